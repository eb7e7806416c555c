import { blochGruneisenRatio } from '../../../lib/transport/physics/bloch-gruneisen';
import { fixed, sci, textFile } from './format';
import { CONSORTIUM_FUNDING, INVENTED_NOTE, creator } from './people';
import { seededNormal } from './random';
import type { DemoDeposit } from './types';

// The resistive transition of a niobium wire on slow cooling, four-wire, DC current reversal (Larkspur Cryogenic Lab).
// Normal state: ρ_n(T) = ρ0 + ρ_i(273.15 K)·BG(T)/BG(273.15 K), Θ = 275 K; transition: ρ = ρ_n·½[1 + tanh((T − Tc)/w)],
// so ρ = ρ_n/2 exactly at Tc (the half-point). Nb: Tc = 9.25 K (common practice, pure Nb).
export const NB_WIRE = {
  criticalK: 9.25,
  widthK: 0.04,
  debyeK: 275,
  residualOhmM: 2.4e-9, // ρ0 = 0.24 µΩ·cm: an RRR of about 60
  idealAt273_15OhmM: 1.45e-7, // ρ(273 K) ≈ 14.5 µΩ·cm for niobium
  lengthM: 8e-3,
  diameterM: 0.25e-3,
  currentA: 5e-3,
  fromK: 14,
  toK: 5,
  rateKPerMin: 0.1,
  intervalS: 6,
  thermoelectricV: 1.5e-6, // offset that does not reverse with the current, drifting by 0.2 µV over the run
  voltageNoiseV: 3e-9,
  seed: 0x4e62,
};

const areaM2 = (Math.PI * NB_WIRE.diameterM ** 2) / 4; // A = πd²/4

/** Normal-state ρ_n(T) (Ω·m). */
export const nbNormalResistivity = (temperatureK: number) =>
  NB_WIRE.residualOhmM + NB_WIRE.idealAt273_15OhmM * blochGruneisenRatio(temperatureK, NB_WIRE.debyeK);

/** ρ(T) through the transition (Ω·m). */
export const nbResistivity = (temperatureK: number) =>
  nbNormalResistivity(temperatureK) * 0.5 * (1 + Math.tanh((temperatureK - NB_WIRE.criticalK) / NB_WIRE.widthK));

export const nbResistance = (temperatureK: number) => (nbResistivity(temperatureK) * NB_WIRE.lengthM) / areaM2; // R = ρL/A

function runFile(): Uint8Array {
  const p = NB_WIRE;
  const noise = seededNormal(p.seed);
  const lines = [
    '# Larkspur Cryogenic Lab - resistance log',
    '# Sample: LCL-Nb-W03 (Nb wire, d = 0.25 mm, 8 mm between voltage taps)',
    '# Started: 2031-04-02 16:40:12',
    `# Ramp: ${p.fromK} K to ${p.toK} K at ${p.rateKPerMin} K/min, reading every ${p.intervalS} s`,
    '# Excitation: 5.000 mA DC; V_pos at +I, V_neg at -I; R = (V_pos - V_neg)/(2 I)',
    'Time (s),T (K),V_pos (uV),V_neg (uV),R (mOhm)',
  ];
  const duration = ((p.fromK - p.toK) / p.rateKPerMin) * 60;
  for (let t = 0; t <= duration + 1e-9; t += p.intervalS) {
    const temperature = p.fromK - (p.rateKPerMin * t) / 60;
    const offset = p.thermoelectricV + 0.2e-6 * (t / duration);
    const v = p.currentA * nbResistance(temperature);
    const vPos = v + offset + p.voltageNoiseV * noise();
    const vNeg = -v + offset + p.voltageNoiseV * noise();
    const r = (vPos - vNeg) / (2 * p.currentA); // the instrument's reversal average
    const measuredT = temperature + 0.0008 * noise();
    lines.push(`${fixed(t, 0)},${fixed(measuredT, 4)},${sci(vPos * 1e6, 5)},${sci(vNeg * 1e6, 5)},${sci(r * 1e3, 5)}`);
  }
  return textFile(lines);
}

export function niobiumTransitionDeposit(): DemoDeposit {
  const author = 'ada.penhallow@larkspur.example';
  const title = 'Superconducting transition of a niobium wire near 9.2 K';
  return {
    groupSlug: 'larkspur-cryogenic',
    authorEmail: author,
    title,
    publish: false,
    files: [{ name: 'LCL-Nb-W03_transition_cooling.csv', role: 'raw', bytes: runFile() }],
    record: {
      title,
      description: [
        'Four-wire resistance of a **niobium wire** cooled slowly (0.1 K/min) through its superconducting transition.',
        'Each reading reverses a 5 mA DC current; the thermoelectric offset of about 1.5 µV cancels in (V₊ − V₋)/2.',
        'Work with liquid helium and cold wires follows the lab’s cryogen safety rules; check your own local rules.',
        '',
        INVENTED_NOTE,
      ].join('\n'),
      creators: [creator(author), creator('tobin.ashgrove@larkspur.example')],
      keywords: ['niobium', 'superconductivity', 'critical temperature', 'current reversal'],
      license: 'CC-BY-4.0',
      funding: CONSORTIUM_FUNDING,
      sample: {
        name: 'LCL-Nb-W03',
        material: 'niobium',
        formula: 'Nb',
        form: 'wire',
        geometry: { lengthBetweenVoltageContacts: { value: 8, unit: 'mm' }, diameter: { value: 0.25, unit: 'mm' } },
        contacts: { configuration: 'four-wire-linear', contactMaterial: 'spot-welded Nb taps', spacing: { value: 8, unit: 'mm' } },
      },
      measurement: {
        quantity: 'resistance',
        mode: 'four-wire',
        excitation: { type: 'dc-reversal', currentAmplitude: { value: 5, unit: 'mA' } },
        detection: { instrumentType: 'dc-voltmeter', averagingWindow: { value: 1, unit: 's' }, averagingCount: 2 },
      },
      environment: {
        temperatureRange: { min: 5, max: 14, unit: 'K' },
        fieldRange: { min: 0, max: 0, unit: 'T' },
        sweepVariable: 'temperature',
        sweepRate: { value: 0.1, unit: 'K/min' },
        sweepDirection: 'down',
      },
      columns: [
        { name: 'Time', quantity: 'time', unit: 's', role: 'aux' },
        { name: 'T', quantity: 'temperature', unit: 'K', role: 'x' },
        { name: 'V_pos', quantity: 'voltage', unit: 'uV', role: 'aux' },
        { name: 'V_neg', quantity: 'voltage', unit: 'uV', role: 'aux' },
        { name: 'R', quantity: 'resistance', unit: 'mOhm', role: 'y' },
      ],
    },
  };
}
