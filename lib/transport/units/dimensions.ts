/** Physical dimensions Ohmstead distinguishes; each has one SI (coherent) UCUM unit. */
export type Dimension =
  | 'temperature'
  | 'temperatureRate'
  | 'magneticFluxDensity'
  | 'magneticFluxDensityRate'
  | 'magneticFieldStrength'
  | 'resistance'
  | 'sheetResistance'
  | 'resistivity'
  | 'conductance'
  | 'conductivity'
  | 'current'
  | 'voltage'
  | 'voltageNoisePsd'
  | 'frequency'
  | 'angle'
  | 'time'
  | 'length'
  | 'area'
  | 'mobility'
  | 'carrierDensity'
  | 'sheetCarrierDensity'
  | 'hallCoefficient'
  | 'sheetHallCoefficient'
  | 'charge'
  | 'capacitance'
  | 'inductance'
  | 'power'
  | 'energy'
  | 'dimensionless';

/**
 * SI unit (UCUM code) of each dimension. Order matters: when two dimensions share base-unit
 * exponents (resistance and sheet resistance), the first wins unless the code carries '{sq}'.
 */
export const SI_UCUM: Readonly<Record<Dimension, string>> = {
  temperature: 'K',
  temperatureRate: 'K/s',
  magneticFluxDensity: 'T',
  magneticFluxDensityRate: 'T/s',
  magneticFieldStrength: 'A/m',
  resistance: 'Ohm',
  sheetResistance: 'Ohm/{sq}',
  resistivity: 'Ohm.m',
  conductance: 'S',
  conductivity: 'S/m',
  current: 'A',
  voltage: 'V',
  // UCUM has no square root of hertz, so noise density is stored as a power spectral density.
  voltageNoisePsd: 'V2/Hz',
  frequency: 'Hz',
  angle: 'rad',
  time: 's',
  length: 'm',
  area: 'm2',
  mobility: 'm2/(V.s)',
  carrierDensity: 'm-3',
  sheetCarrierDensity: 'm-2',
  hallCoefficient: 'm3/C',
  sheetHallCoefficient: 'm2/C',
  charge: 'C',
  capacitance: 'F',
  inductance: 'H',
  power: 'W',
  energy: 'J',
  dimensionless: '1',
};

export const DIMENSIONS = Object.keys(SI_UCUM) as Dimension[];
