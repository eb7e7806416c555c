import { fixed, textFile } from './format';
import { CONSORTIUM_FUNDING, INVENTED_NOTE, creator } from './people';
import { seededNormal } from './random';
import type { DemoDeposit } from './types';

// A ±14 T field sweep of a WTe2 flake at 2 K, AC lock-in at 13.7 Hz (Cobalt Ridge Magnetotransport Lab).
// Compensated semimetal: R(B) = R0·(1 + (μ_MR·B)²), non-saturating (two-band model with n = p); the contacts add a
// small Hall pick-up c·B, odd in B, which symmetrising over ±B removes (Onsager).
export const MR_SWEEP = {
  residualOhmM: 2.0e-8, // ρ0 = 2 µΩ·cm at 2 K
  lengthM: 12e-6,
  widthM: 4e-6,
  thicknessM: 45e-9,
  mobilityPerT: 0.357, // μ_MR: MR(14 T) = (0.357·14)² ≈ 25 = 2 500 %
  hallPickupOhmPerT: 0.004,
  currentA: 10e-6,
  frequencyHz: 13.7,
  maxFieldT: 14,
  rateTPerMin: 0.25,
  intervalS: 2,
  quadratureFraction: 0.003, // Y/X from the leads' capacitance
  noiseV: 5e-9,
  temperatureK: 2.0,
  seed: 0x3e7a,
};

export const mrZeroFieldOhm = () => (MR_SWEEP.residualOhmM * MR_SWEEP.lengthM) / (MR_SWEEP.widthM * MR_SWEEP.thicknessM); // R = ρL/(w t)

/** Four-wire R(B) in Ω, including the odd pick-up. */
export const mrResistance = (fieldT: number) =>
  mrZeroFieldOhm() * (1 + (MR_SWEEP.mobilityPerT * fieldT) ** 2) + MR_SWEEP.hallPickupOhmPerT * fieldT;

function sweepFile(): Uint8Array {
  const p = MR_SWEEP;
  const noise = seededNormal(p.seed);
  const lines = [
    '# Cobalt Ridge Magnetotransport Lab - lock-in field sweep',
    '# Sample: CRM-WT-11 (WTe2 flake, 45 nm, voltage taps 12 um apart, 4 um wide)',
    '# Started: 2031-05-20 22:05:41',
    '# Lock-in: 13.7 Hz, 10 uA rms sine, time constant 100 ms, 24 dB/oct',
    `# Sweep: -${p.maxFieldT} T to +${p.maxFieldT} T at ${p.rateTPerMin} T/min, reading every ${p.intervalS} s`,
    'Time (s)\tField (T)\tTemp (K)\tX (uV)\tY (uV)',
  ];
  const duration = ((2 * p.maxFieldT) / p.rateTPerMin) * 60;
  for (let t = 0; t <= duration + 1e-9; t += p.intervalS) {
    const b = Math.min(p.maxFieldT, -p.maxFieldT + (p.rateTPerMin * t) / 60);
    const x = p.currentA * mrResistance(b);
    const y = p.quadratureFraction * x;
    const temperature = p.temperatureK + 0.0015 * noise();
    lines.push([fixed(t, 1), fixed(b, 5), fixed(temperature, 4), fixed((x + p.noiseV * noise()) * 1e6, 4), fixed((y + p.noiseV * noise()) * 1e6, 4)].join('\t'));
  }
  return textFile(lines);
}

export function magnetoresistanceDeposit(): DemoDeposit {
  const author = 'noor.halvorsen@cobaltridge.example';
  const title = 'Non-saturating magnetoresistance of a WTe2 flake at 2 K up to ±14 T';
  return {
    groupSlug: 'cobalt-ridge-magnetotransport',
    authorEmail: author,
    title,
    publish: true,
    files: [{ name: 'CRM-WT-11_MR_2K_pm14T.tsv', role: 'raw', bytes: sweepFile() }],
    record: {
      title,
      description: [
        'Four-wire **magnetoresistance** of an exfoliated WTe2 flake at 2 K, swept from −14 T to +14 T at 0.25 T/min.',
        'AC excitation of 10 µA at 13.7 Hz (away from mains harmonics), digital lock-in with a 100 ms, 24 dB/oct filter.',
        'Symmetrise over ±B before use: the raw curve holds a small odd Hall pick-up. High-field work follows the',
        'facility’s magnet safety rules; check your own local rules before repeating it.',
        '',
        INVENTED_NOTE,
      ].join('\n'),
      creators: [creator(author), creator('ilse.brandvold@cobaltridge.example')],
      keywords: ['WTe2', 'magnetoresistance', 'semimetal', 'lock-in'],
      license: 'CC-BY-4.0',
      funding: CONSORTIUM_FUNDING,
      sample: {
        name: 'CRM-WT-11',
        material: 'tungsten ditelluride',
        formula: 'WTe2',
        form: 'flake',
        substrate: '285 nm SiO2 on Si',
        geometry: {
          lengthBetweenVoltageContacts: { value: 12, unit: 'um' },
          width: { value: 4, unit: 'um' },
          thickness: { value: 45, unit: 'nm' },
        },
        contacts: { configuration: 'four-wire-linear', contactMaterial: 'Cr/Au, e-beam patterned', spacing: { value: 12, unit: 'um' } },
      },
      measurement: {
        quantity: 'magnetoresistance',
        mode: 'four-wire',
        excitation: { type: 'ac', currentAmplitude: { value: 10, unit: 'uA' }, frequency: { value: 13.7, unit: 'Hz' } },
        detection: { instrumentType: 'digital-lock-in', timeConstant: { value: 100, unit: 'ms' }, filterOrder: 4, filterSlope: 24 },
      },
      environment: {
        temperatureRange: { min: 2, max: 2, unit: 'K' },
        fieldRange: { min: -14, max: 14, unit: 'T' },
        fieldOrientation: 'out-of-plane',
        sweepVariable: 'field',
        sweepRate: { value: 0.25, unit: 'T/min' },
        sweepDirection: 'up',
      },
      columns: [
        { name: 'Time', quantity: 'time', unit: 's', role: 'aux' },
        { name: 'Field', quantity: 'field', unit: 'T', role: 'x' },
        { name: 'Temp', quantity: 'temperature', unit: 'K', role: 'aux' },
        { name: 'X', quantity: 'lock-in-x', unit: 'uV', role: 'y' },
        { name: 'Y', quantity: 'lock-in-y', unit: 'uV', role: 'aux' },
      ],
    },
  };
}
