// Resistivity and sheet resistance from resistance and sample geometry. SI in, SI out.

function requirePositive(name: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`${name} must be a positive finite number, got ${value}.`);
}

/** ρ = R·A/L for any cross-section area A between voltage contacts a distance L apart (Ω·m). */
export function resistivityFromCrossSection(resistanceOhm: number, areaM2: number, lengthM: number): number {
  requirePositive('areaM2', areaM2);
  requirePositive('lengthM', lengthM);
  return (resistanceOhm * areaM2) / lengthM; // definition of resistivity, ρ = R·A/L
}

/** Bar or Hall bar: ρ = R·w·t/L, L the voltage-contact spacing (Ω·m). */
export function resistivityFromBar(resistanceOhm: number, widthM: number, thicknessM: number, lengthM: number): number {
  requirePositive('widthM', widthM);
  requirePositive('thicknessM', thicknessM);
  return resistivityFromCrossSection(resistanceOhm, widthM * thicknessM, lengthM); // A = w·t
}

/** Round wire: ρ = R·πd²/(4L) (Ω·m). */
export function resistivityFromWire(resistanceOhm: number, diameterM: number, lengthM: number): number {
  requirePositive('diameterM', diameterM);
  return resistivityFromCrossSection(resistanceOhm, (Math.PI * diameterM * diameterM) / 4, lengthM); // A = πd²/4
}

/** Sheet resistance R_s = ρ/t (Ω/sq) of a film of thickness t. */
export function sheetResistanceFromResistivity(resistivityOhmM: number, thicknessM: number): number {
  requirePositive('thicknessM', thicknessM);
  return resistivityOhmM / thicknessM; // definition, R_s = ρ/t
}

/** ρ = R_s·t (Ω·m) from a sheet resistance and the film thickness. */
export function resistivityFromSheetResistance(sheetResistanceOhmPerSq: number, thicknessM: number): number {
  requirePositive('thicknessM', thicknessM);
  return sheetResistanceOhmPerSq * thicknessM; // inverse of R_s = ρ/t
}

/** Sheet resistance of a bar without knowing t: R_s = R·w/L (Ω/sq), L/w being the number of squares. */
export function sheetResistanceFromBar(resistanceOhm: number, widthM: number, lengthM: number): number {
  requirePositive('widthM', widthM);
  requirePositive('lengthM', lengthM);
  return (resistanceOhm * widthM) / lengthM; // R = R_s·(L/w)
}
