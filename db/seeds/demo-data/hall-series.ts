import { ELEMENTARY_CHARGE_C } from '../../../lib/transport/physics/constants';
import { fixed, textFile } from './format';
import { CONSORTIUM_FUNDING, INVENTED_NOTE, creator } from './people';
import { seededNormal } from './random';
import type { DemoDeposit } from './types';

// Hall-bar field sweeps of an n-type GaAs:Si epilayer at five temperatures (Cobalt Ridge Magnetotransport Lab).
// Single-band Drude model: ρ = 1/(n e μ), R_xy = −B/(n e t) for electrons, R_xx = ρL/(w t)·(1 + k(μB)²).
// R_xy also picks up a small fraction of R_xx (voltage contacts off the equipotential), even in B.
export const HALL_SERIES = {
  lengthM: 1.0e-3,
  widthM: 200e-6,
  thicknessM: 500e-9,
  currentA: 10e-6,
  maxFieldT: 1,
  stepT: 0.025,
  mrFactor: 0.1, // k: a weak magnetoresistance, as in a real single-valley semiconductor
  misalignment: 0.004, // δ: R_xy offset = δ·R_xx(B)
  noiseOhm: 0.02,
  // Carrier density (cm⁻³) and Hall mobility (cm²/(V·s)) chosen per temperature: mild freeze-out, an impurity- then
  // phonon-limited mobility; typical of GaAs near 1e17 cm⁻³.
  points: [
    { temperatureK: 10, densityPerCm3: 5.9e16, mobilityCm2PerVs: 2600 },
    { temperatureK: 50, densityPerCm3: 6.8e16, mobilityCm2PerVs: 4100 },
    { temperatureK: 100, densityPerCm3: 8.5e16, mobilityCm2PerVs: 5200 },
    { temperatureK: 200, densityPerCm3: 9.6e16, mobilityCm2PerVs: 4900 },
    { temperatureK: 300, densityPerCm3: 1.0e17, mobilityCm2PerVs: 3800 },
  ],
  seed: 0x4a11,
};

type HallPoint = (typeof HALL_SERIES.points)[number];

/** R_xx(B) and R_xy(B) in Ω for one temperature of the series. */
export function hallResistances(point: HallPoint, fieldT: number): { rxx: number; rxy: number } {
  const p = HALL_SERIES;
  const n = point.densityPerCm3 * 1e6; // m⁻³
  const mu = point.mobilityCm2PerVs * 1e-4; // m²/(V·s)
  const rho = 1 / (n * ELEMENTARY_CHARGE_C * mu); // Drude
  const rxx = ((rho * p.lengthM) / (p.widthM * p.thicknessM)) * (1 + p.mrFactor * (mu * fieldT) ** 2);
  const rxy = -fieldT / (n * ELEMENTARY_CHARGE_C * p.thicknessM) + p.misalignment * rxx; // electrons: R_H = −1/(ne)
  return { rxx, rxy };
}

export const hallFileName = (point: HallPoint) => `CRM-HB-07_hall_${String(point.temperatureK).padStart(3, '0')}K.dat`;

function sweepFile(point: HallPoint, index: number): Uint8Array {
  const p = HALL_SERIES;
  const noise = seededNormal(p.seed + index);
  const lines = [
    '; Cobalt Ridge Magnetotransport Lab',
    '; Device = CRM-HB-07 (GaAs:Si Hall bar, w = 200 um, L = 1.0 mm, t = 500 nm)',
    `; Temperature = ${fixed(point.temperatureK, 1)} K`,
    '; Excitation = 10 uA DC, reversed for each reading',
    '; Sweep = -1 T to +1 T in 25 mT steps, field held for each reading',
    '    B (T)       Rxx (Ohm)      Rxy (Ohm)      T (K)',
  ];
  const steps = Math.round((2 * p.maxFieldT) / p.stepT);
  for (let i = 0; i <= steps; i++) {
    const b = -p.maxFieldT + i * p.stepT;
    const { rxx, rxy } = hallResistances(point, b);
    const t = point.temperatureK + 0.01 * noise();
    lines.push(
      `${fixed(b, 4).padStart(9)}  ${fixed(rxx + p.noiseOhm * noise(), 4).padStart(14)}  ${fixed(rxy + p.noiseOhm * noise(), 4).padStart(13)}  ${fixed(t, 3).padStart(9)}`,
    );
  }
  return textFile(lines, { eol: '\r\n' });
}

export function hallSeriesDeposit(): DemoDeposit {
  const author = 'noor.halvorsen@cobaltridge.example';
  const title = 'Hall effect of an n-type GaAs:Si epilayer from 10 K to 300 K';
  return {
    groupSlug: 'cobalt-ridge-magnetotransport',
    authorEmail: author,
    title,
    publish: true,
    files: HALL_SERIES.points.map((point, i) => ({ name: hallFileName(point), role: 'raw' as const, bytes: sweepFile(point, i) })),
    record: {
      title,
      description: [
        'Longitudinal and Hall resistance of a **GaAs:Si Hall bar** (500 nm epilayer) in field sweeps between −1 T and +1 T,',
        'one file per temperature (10, 50, 100, 200 and 300 K). R_xy carries a small offset even in B from contact',
        'misalignment; antisymmetrising over ±B removes it before the carrier density is taken from the slope.',
        '',
        INVENTED_NOTE,
      ].join('\n'),
      creators: [creator(author), creator('kit.falconridge@cobaltridge.example')],
      keywords: ['GaAs', 'Hall effect', 'carrier density', 'mobility', 'freeze-out'],
      license: 'CC-BY-4.0',
      funding: CONSORTIUM_FUNDING,
      sample: {
        name: 'CRM-HB-07',
        material: 'silicon-doped gallium arsenide epilayer',
        formula: 'GaAs:Si',
        form: 'thin-film',
        substrate: 'semi-insulating GaAs (100)',
        geometry: {
          lengthBetweenVoltageContacts: { value: 1.0, unit: 'mm' },
          width: { value: 200, unit: 'um' },
          thickness: { value: 500, unit: 'nm' },
        },
        contacts: { configuration: 'hall-bar', contactMaterial: 'alloyed Ni/AuGe/Ni/Au', spacing: { value: 1.0, unit: 'mm' } },
      },
      measurement: {
        quantity: 'hall-resistance',
        mode: 'four-wire',
        excitation: { type: 'dc-reversal', currentAmplitude: { value: 10, unit: 'uA' } },
        detection: { instrumentType: 'dc-voltmeter', averagingCount: 2 },
      },
      environment: {
        temperatureRange: { min: 10, max: 300, unit: 'K' },
        fieldRange: { min: -1, max: 1, unit: 'T' },
        fieldOrientation: 'out-of-plane',
        sweepVariable: 'field',
        sweepDirection: 'up',
      },
      columns: [
        { name: 'B', quantity: 'field', unit: 'T', role: 'x' },
        { name: 'Rxx', quantity: 'resistance', unit: 'Ohm', role: 'y' },
        { name: 'Rxy', quantity: 'hall-resistance', unit: 'Ohm', role: 'y' },
        { name: 'T', quantity: 'temperature', unit: 'K', role: 'aux' },
      ],
    },
  };
}
