export { phenotypeLabel, groupByPhenotype } from "./phenotype-labels";
export type { MarkerValue, PhenotypeLabel } from "./phenotype-labels";
