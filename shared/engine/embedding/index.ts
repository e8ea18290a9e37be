export { functionalGraph, ShapeRegistry, type FunctionalGraph } from "./functional-graph";
export {
  embedFunctionalGraph,
  findDynamicalEmbedding,
  searchDynamicalEmbedding,
  type EmbeddingResult,
  type EmbeddingControl,
} from "./dynamical-embedding";
