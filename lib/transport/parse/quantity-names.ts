import type { TransportQuantity } from './types';

// Column names seen in transport exports, normalised (lower case; spaces, _ - . ( ) removed). Common practice.
const EXACT: Record<string, TransportQuantity> = {};
const add = (q: TransportQuantity, names: string) => names.split(' ').forEach((n) => (EXACT[n] = q));
add('temperature', 'temp temperature tsample tsamp sampletemp sampletemperature tprobe probetemp probetemperature tsensor sensortemp tk tvti tcryo tset tsetpoint tcontrol');
add('field', 'b h field bfield hfield magneticfield magfield appliedfield mu0h μ0h b0 bext');
add('resistance', 'r res resistance rxx r_xx rsample r4w r4p rsamp rlong rxx1 rxx2');
add('hall-resistance', 'rxy ryx rhall hallresistance rtrans rxy1 rxy2');
add('sheet-resistance', 'rs rsheet rsq r□ sheetresistance rsh');
add('resistivity', 'rho ρ rhoxx ρxx resistivity');
add('hall-resistivity', 'rhoxy ρxy rhoyx ρyx hallresistivity');
add('magnetoresistance', 'mr magnetoresistance drr δrr deltarr');
add('conductance', 'g gxx conductance');
add('conductivity', 'sigma σ sigmaxx σxx conductivity');
add('voltage', 'v vx vxx vxy vy voltage u vsample v4w vhall vh vlong vtrans');
add('lock-in-x', 'x lockinx xlockin xv');
add('lock-in-y', 'y lockiny ylockin yv');
add('lock-in-phase', 'phase lockinphase θlockin');
add('current', 'i current iexc iexcitation excitation isource isrc ibias isd ids');
add('frequency', 'f freq frequency');
add('angle', 'angle theta θ phi φ rotation rot rotator tilt');
add('time', 'time timestamp elapsed elapsedtime times timesec clock');
add('gate-voltage', 'vg vgate gate gatevoltage vbg vtg vgs');
add('thermometer-resistance', 'rtherm rthermometer thermometer rpt rcernox rsensor sensorresistance rthermo');

// Prefixes for longer names ("Temperature_sample", "Rxx_A", "Field_set"); less certain than an exact name.
const PREFIXES: [string, TransportQuantity][] = [
  ['temp', 'temperature'], ['rxy', 'hall-resistance'], ['ryx', 'hall-resistance'], ['rxx', 'resistance'],
  ['rho', 'resistivity'], ['resist', 'resistance'], ['field', 'field'], ['magneticfield', 'field'],
  ['volt', 'voltage'], ['curr', 'current'], ['freq', 'frequency'], ['time', 'time'], ['angle', 'angle'],
  ['phase', 'lock-in-phase'], ['theta', 'angle'], ['gate', 'gate-voltage'], ['therm', 'thermometer-resistance'],
];

export type NameMatch = { quantity: TransportQuantity; confidence: number; rule: string };

export function normaliseName(name: string): string {
  return name.toLowerCase().replace(/[\s_\-.()[\]{}]/g, '');
}

/** Quantity suggested by a column name alone; undefined when the name says nothing. */
export function quantityFromName(name: string): NameMatch | undefined {
  const trimmed = name.trim();
  // Case carries meaning for one letter: T is temperature, t is time (common practice).
  if (trimmed === 'T') return { quantity: 'temperature', confidence: 0.9, rule: "name T → temperature" };
  if (trimmed === 't') return { quantity: 'time', confidence: 0.6, rule: "name t → time (lower-case t)" };
  const key = normaliseName(trimmed);
  if (key === '') return undefined;
  const exact = EXACT[key];
  if (exact) return { quantity: exact, confidence: 0.9, rule: `name ${trimmed} → ${exact}` };
  if (/^r\d+$/.test(key)) return { quantity: 'resistance', confidence: 0.8, rule: `name ${trimmed} → resistance (R + channel number)` };
  for (const [prefix, quantity] of PREFIXES) {
    if (key.startsWith(prefix)) return { quantity, confidence: 0.75, rule: `name ${trimmed} starts with '${prefix}' → ${quantity}` };
  }
  return undefined;
}
