export { readSbmlQual } from "./read-sbml-qual";
export type { SbmlQualModel } from "./read-sbml-qual";
export { writeSbmlQual } from "./write-sbml-qual";
export type { WriteSbmlOptions } from "./write-sbml-qual";
export { MAX_XML_CHARS } from "./xml-tree";
