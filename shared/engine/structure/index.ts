export { interactionGraph, regulatorSign } from "./interaction-graph";
export type { EdgeSign, InteractionEdge, InteractionGraph } from "./interaction-graph";
export { feedbackCircuits } from "./feedback-circuits";
export type { FeedbackCircuit, CircuitSearch } from "./feedback-circuits";
export { tableSensitivity, nodeSensitivities, networkSensitivity } from "./sensitivity";
export { canalizingInputs } from "./canalizing-inputs";
export type { CanalizingInput } from "./canalizing-inputs";
