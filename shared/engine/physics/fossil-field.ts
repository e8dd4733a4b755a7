/**
 * Fossil field of a white dwarf whose main-sequence progenitor was magnetic (an Ap/Bp star):
 * magnetic flux is conserved from the main-sequence surface to the white dwarf,
 * B_WD = B_MS (R_MS/R_WD)² (Wickramasinghe & Ferrario 2005, MNRAS 356, 1576; Tout,
 * Wickramasinghe & Ferrario 2004, MNRAS 355, L13). Units: B_MS in kG, radii in the same
 * unit, result in MG.
 * Example: B_MS = 1 kG, R_MS = 1.95 Rsun, R_WD = 0.0107 Rsun gives 1e-3 · (182)² ≈ 33 MG.
 */
export function fossilFieldMG(mainSequenceFieldKG: number, mainSequenceRadius: number, whiteDwarfRadius: number): number {
  const ratio = mainSequenceRadius / whiteDwarfRadius;
  return mainSequenceFieldKG * 1e-3 * ratio * ratio;
}
