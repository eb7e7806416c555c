import { blochGruneisenResistivity, blochGruneisenShape } from '../../../lib/transport/physics/bloch-gruneisen';
import { CONSORTIUM_FUNDING, INVENTED_NOTE, creator } from './people';
import { fixed, sci, textFile } from './format';
import { seededNormal } from './random';
import type { DemoDeposit } from './types';

// A sputtered copper film measured on warming from 2 K to 300 K at the (invented) Larkspur Cryogenic Lab.
// ρ(T) = ρ0 + C·(T/Θ)^5·J5(Θ/T): Bloch (1930), Grüneisen (1933), through lib/transport/physics.
export const BG_FILM = {
  debyeK: 310, // Θ_R of a copper film, a little below bulk Cu's 343.5 K (common for polycrystalline films)
  residualOhmM: 5.5e-9, // ρ0 = 0.55 µΩ·cm: grain-boundary and surface scattering
  idealAt273_15OhmM: 1.6e-8, // phonon part at 273.15 K, close to bulk copper's 1.54 µΩ·cm
  lengthM: 1.0e-3,
  widthM: 100e-6,
  thicknessM: 50e-9,
  currentA: 100e-6,
  fromK: 2,
  toK: 300,
  rateKPerMin: 1,
  intervalS: 3,
  noiseOhm: 4e-5, // nanovoltmeter noise of ~4 nV per averaged reading at 100 µA
  thermometerNoiseK: 0.002,
  seed: 0x0b6f11,
};

const coupling = BG_FILM.idealAt273_15OhmM / blochGruneisenShape(273.15, BG_FILM.debyeK);

/** The model ρ(T) in Ω·m that the file was generated from. */
export function bgFilmResistivity(temperatureK: number): number {
  return blochGruneisenResistivity(temperatureK, BG_FILM.debyeK, BG_FILM.residualOhmM, coupling);
}

/** R = ρL/(w·t) between the voltage contacts of the patterned bar. */
export const bgFilmResistance = (temperatureK: number) => (bgFilmResistivity(temperatureK) * BG_FILM.lengthM) / (BG_FILM.widthM * BG_FILM.thicknessM);

function runFile(): Uint8Array {
  const noise = seededNormal(BG_FILM.seed);
  const p = BG_FILM;
  const lines = [
    '# Larkspur Cryogenic Lab - resistance log',
    '# Sample: LCL-CuF-21 (Cu film 50 nm on sapphire, bar 100 um x 1.0 mm between voltage taps)',
    '# Started: 2031-03-14 09:12:05',
    `# Ramp: ${p.fromK} K to ${p.toK} K at ${p.rateKPerMin} K/min, reading every ${p.intervalS} s`,
    '# Excitation: 100 uA DC, current reversed for every reading (delta mode), 4 readings averaged',
    'Time (s),T_sample (K),R (Ohm),I (uA)',
  ];
  const steps = Math.floor(((p.toK - p.fromK) / p.rateKPerMin) * 60 / p.intervalS);
  for (let i = 0; i <= steps; i++) {
    const t = i * p.intervalS;
    const temperature = p.fromK + (p.rateKPerMin * t) / 60;
    const measuredT = temperature + p.thermometerNoiseK * noise();
    const r = bgFilmResistance(temperature) + p.noiseOhm * noise();
    lines.push(`${fixed(t, 1)},${fixed(measuredT, 4)},${sci(r, 6)},${fixed(100 + 0.002 * noise(), 3)}`);
  }
  return textFile(lines);
}

export function blochGruneisenFilmDeposit(): DemoDeposit {
  const author = 'ada.penhallow@larkspur.example';
  const title = 'Resistivity of a 50 nm copper film from 2 K to 300 K (Bloch–Grüneisen)';
  return {
    groupSlug: 'larkspur-cryogenic',
    authorEmail: author,
    title,
    publish: true,
    files: [{ name: 'LCL-CuF-21_RT_warming.csv', role: 'raw', bytes: runFile() }],
    record: {
      title,
      description: [
        'Four-wire resistance of a sputtered **copper film** (50 nm on c-plane sapphire), patterned into a 100 µm wide bar,',
        'measured on warming at 1 K/min with DC current reversal. The phonon part follows the Bloch–Grüneisen form with',
        'Θ_R ≈ 310 K on a residual resistivity of about 0.55 µΩ·cm.',
        '',
        INVENTED_NOTE,
      ].join('\n'),
      creators: [creator(author), creator('maren.quillfeather@larkspur.example')],
      keywords: ['copper', 'thin film', 'Bloch-Grüneisen', 'residual resistivity ratio'],
      license: 'CC-BY-4.0',
      funding: CONSORTIUM_FUNDING,
      sample: {
        name: 'LCL-CuF-21',
        material: 'copper',
        formula: 'Cu',
        form: 'thin-film',
        substrate: 'sapphire (0001)',
        geometry: {
          lengthBetweenVoltageContacts: { value: 1.0, unit: 'mm' },
          width: { value: 100, unit: 'um' },
          thickness: { value: 50, unit: 'nm' },
        },
        contacts: { configuration: 'four-wire-linear', contactMaterial: 'Ti/Au pads, Al wire bonds', spacing: { value: 1.0, unit: 'mm' } },
      },
      measurement: {
        quantity: 'resistance',
        mode: 'four-wire',
        excitation: { type: 'dc-reversal', currentAmplitude: { value: 100, unit: 'uA' } },
        detection: { instrumentType: 'dc-voltmeter', averagingCount: 4 },
      },
      environment: {
        temperatureRange: { min: 2, max: 300, unit: 'K' },
        fieldRange: { min: 0, max: 0, unit: 'T' },
        sweepVariable: 'temperature',
        sweepRate: { value: 1, unit: 'K/min' },
        sweepDirection: 'up',
      },
      columns: [
        { name: 'Time', quantity: 'time', unit: 's', role: 'aux' },
        { name: 'T_sample', quantity: 'temperature', unit: 'K', role: 'x' },
        { name: 'R', quantity: 'resistance', unit: 'Ohm', role: 'y' },
        { name: 'I', quantity: 'current', unit: 'uA', role: 'aux' },
      ],
    },
  };
}
