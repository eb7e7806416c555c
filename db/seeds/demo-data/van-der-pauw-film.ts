import { fixed, textFile } from './format';
import { CONSORTIUM_FUNDING, INVENTED_NOTE, creator } from './people';
import { seededNormal } from './random';
import type { DemoDeposit } from './types';

// Van der Pauw R(T) of a 40 nm indium tin oxide film on warming (Tidewater Thin Films Group).
// A degenerate oxide: R_s(T) = R_s(300 K)·[1 + α(T − 300 K)] + β·ln(300 K/T), the log term the weak low-T upturn
// (electron–electron interaction in a disordered film). The two configurations differ: R_A/R_B = 1.35.
export const VDP_FILM = {
  sheetAt300OhmSq: 52.0,
  alphaPerK: 2.0e-4,
  logOhmSq: 0.35,
  ratio: 1.35,
  thicknessM: 40e-9,
  currentA: 50e-6,
  fromK: 10,
  toK: 300,
  rateKPerMin: 2,
  intervalS: 10,
  noiseOhm: 0.003,
  seed: 0x7d9f,
};

export const vdpSheetResistance = (temperatureK: number) =>
  VDP_FILM.sheetAt300OhmSq * (1 + VDP_FILM.alphaPerK * (temperatureK - 300)) + VDP_FILM.logOhmSq * Math.log(300 / temperatureK);

/**
 * R_B/R_s for R_A = Q·R_B: the root of exp(−πQy) + exp(−πy) = 1 (van der Pauw, Philips Res. Rep. 13, 1 (1958)),
 * by bisection (independent of lib/transport's Newton solver, which the tests check against it).
 */
export function vdpReducedResistance(q: number): number {
  let lo = 0; // f(0) = 1 > 0
  let hi = Math.LN2 / Math.PI; // f < 0 here for q > 1 (and = 0 for q = 1)
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (Math.exp(-Math.PI * q * mid) + Math.exp(-Math.PI * mid) - 1 > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

function runFile(): Uint8Array {
  const p = VDP_FILM;
  const noise = seededNormal(p.seed);
  const y = vdpReducedResistance(p.ratio);
  const lines = [
    '! Tidewater Thin Films Group - van der Pauw run',
    '! Film: TTF-ITO-040, In2O3:Sn 40 nm on fused silica, 5 mm square, indium corner contacts',
    '! Operator note: holder at 21 °C before cooling',
    `! Warming ${p.fromK} K to ${p.toK} K at ${p.rateKPerMin} K/min; 50 µA DC, reversed`,
    'T (K);R_A (Ohm);R_B (Ohm)',
  ];
  const duration = ((p.toK - p.fromK) / p.rateKPerMin) * 60;
  for (let t = 0; t <= duration + 1e-9; t += p.intervalS) {
    const temperature = p.fromK + (p.rateKPerMin * t) / 60;
    const rs = vdpSheetResistance(temperature);
    const rb = y * rs;
    const ra = p.ratio * rb;
    lines.push([fixed(temperature + 0.005 * noise(), 3), fixed(ra + p.noiseOhm * noise(), 4), fixed(rb + p.noiseOhm * noise(), 4)].join(';').replace(/\./g, ','));
  }
  // The lab's export program writes Windows code page text with CRLF.
  return textFile(lines, { eol: '\r\n', encoding: 'latin1' });
}

export function vanDerPauwDeposit(): DemoDeposit {
  const author = 'joss.merriweather@tidewater.example';
  const title = 'Van der Pauw sheet resistance of a 40 nm ITO film, 10–300 K';
  return {
    groupSlug: 'tidewater-thin-films',
    authorEmail: author,
    title,
    publish: true,
    files: [{ name: 'TTF-ITO-040_vdP_warming.csv', role: 'raw', bytes: runFile() }],
    record: {
      title,
      description: [
        'Sheet resistance of a sputtered **indium tin oxide** film (40 nm) by the van der Pauw method, from the two',
        'four-terminal resistances R_A and R_B (unequal: the corner contacts are not perfectly symmetric).',
        'Nearly metallic, with a weak logarithmic rise below about 30 K.',
        '',
        INVENTED_NOTE,
      ].join('\n'),
      creators: [creator(author), creator('lena.korsvik@tidewater.example')],
      keywords: ['indium tin oxide', 'van der Pauw', 'sheet resistance', 'transparent conductor'],
      license: 'CC-BY-4.0',
      funding: CONSORTIUM_FUNDING,
      sample: {
        name: 'TTF-ITO-040',
        material: 'indium tin oxide',
        formula: 'In2O3:Sn',
        form: 'thin-film',
        substrate: 'fused silica',
        geometry: { width: { value: 5, unit: 'mm' }, thickness: { value: 40, unit: 'nm' } },
        contacts: { configuration: 'van-der-pauw', contactMaterial: 'indium dots at the corners' },
      },
      measurement: {
        quantity: 'sheet-resistance',
        mode: 'four-wire',
        excitation: { type: 'dc-reversal', currentAmplitude: { value: 50, unit: 'uA' } },
        detection: { instrumentType: 'dc-voltmeter', averagingCount: 4 },
      },
      environment: {
        temperatureRange: { min: 10, max: 300, unit: 'K' },
        fieldRange: { min: 0, max: 0, unit: 'T' },
        sweepVariable: 'temperature',
        sweepRate: { value: 2, unit: 'K/min' },
        sweepDirection: 'up',
      },
      columns: [
        { name: 'T', quantity: 'temperature', unit: 'K', role: 'x' },
        { name: 'R_A', quantity: 'resistance', unit: 'Ohm', role: 'y' },
        { name: 'R_B', quantity: 'resistance', unit: 'Ohm', role: 'y' },
      ],
    },
  };
}
