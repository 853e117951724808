/** Conductor material: copper, or aluminium / copper-clad aluminium (the NEC tables share one column for both). */
export type Material = "cu" | "al";
/** Insulation temperature rating columns of Table 310.16. */
export type TempRatingC = 60 | 75 | 90;
