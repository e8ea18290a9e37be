export { analyseSynchronous, forEachBasinState, attractorsAsText } from "./synchronous-analysis";
export type { SynchronousAnalysis, SynchronousAttractor } from "./synchronous-analysis";
export { asynchronousAttractors, MAX_ASYNC_NODES } from "./asynchronous-attractors";
export type { AsynchronousAnalysis, AsynchronousAttractor } from "./asynchronous-attractors";
export { sampleAttractors } from "./sampled-attractors";
export type { SampledAttractor, SampledAttractors, SampleOptions } from "./sampled-attractors";
