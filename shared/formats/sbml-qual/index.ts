export { readSbmlQual } from "./read-sbml-qual";
export type { SbmlQualModel } from "./read-sbml-qual";
export { writeSbmlQual } from "./write-sbml-qual";
export type { WriteSbmlOptions } from "./write-sbml-qual";
export { MAX_XML_CHARS, MAX_XML_DEPTH, MAX_XML_ELEMENTS } from "./xml-tree";
