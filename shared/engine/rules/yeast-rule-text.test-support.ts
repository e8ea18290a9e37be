// The budding-yeast cell-cycle threshold network in rule text: Li, Long, Lu, Ouyang, Tang, "The yeast cell-cycle
// network is robustly designed", PNAS 101 (2004), Fig. 1 and Table 1 (a_g = 1, a_r = -1, threshold 0; ties keep the
// value except for the self-degrading nodes Cln3, Cln1,2, Swi5, Cdc20&Cdc14, Mcm1/SFF). Wiring written from memory;
// the published synchronous result is seven fixed points with basins 1764, 151, 109, 9, 7, 7, 1 of 2048 states
// (value from memory), the biggest being the G1 state with only Cdh1 and Sic1 on.
export const YEAST_RULE_TEXT = `Cln3' = threshold(; tie zero)
MBF' = threshold(+1 Cln3, -1 Clb12; tie keep)
SBF' = threshold(+1 Cln3, -1 Clb12; tie keep)
Cln12' = threshold(+1 SBF; tie zero)
Cdh1' = threshold(-1 Cln12, -1 Clb56, -1 Clb12, +1 Cdc20; tie keep)
Swi5' = threshold(+1 Cdc20, +1 Mcm1, -1 Clb12; tie zero)
Cdc20' = threshold(+1 Clb12, +1 Mcm1; tie zero)
Clb56' = threshold(+1 MBF, -1 Sic1, -1 Cdc20; tie keep)
Sic1' = threshold(-1 Cln12, -1 Clb56, -1 Clb12, +1 Cdc20, +1 Swi5; tie keep)
Clb12' = threshold(+1 Clb56, +1 Mcm1, -1 Cdc20, -1 Cdh1, -1 Sic1; tie keep)
Mcm1' = threshold(+1 Clb56, +1 Clb12; tie zero)
`;
