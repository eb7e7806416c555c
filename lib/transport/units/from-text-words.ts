// Spelled-out unit words found in instrument headers, matched case-insensitively (only words of 3+ letters).
export const UNIT_WORDS: Readonly<Record<string, string>> = {
  kelvin: 'K', kelvins: 'K', degk: 'K', celsius: 'Cel', degc: 'Cel', degf: '[degF]', fahrenheit: '[degF]',
  tesla: 'T', teslas: 'T', gauss: 'G', oersted: 'Oe', oersteds: 'Oe',
  ohm: 'Ohm', ohms: 'Ohm', volt: 'V', volts: 'V', amp: 'A', amps: 'A', ampere: 'A', amperes: 'A',
  hertz: 'Hz', hz: 'Hz', sec: 's', secs: 's', second: 's', seconds: 's', minute: 'min', minutes: 'min', mins: 'min',
  hour: 'h', hours: 'h', hrs: 'h', deg: 'deg', degree: 'deg', degrees: 'deg', rad: 'rad', radian: 'rad',
  radians: 'rad', meter: 'm', meters: 'm', metre: 'm', metres: 'm', watt: 'W', watts: 'W', siemens: 'S',
  coulomb: 'C', coulombs: 'C', percent: '%', pct: '%', ppm: '[ppm]', square: '{sq}', sq: '{sq}',
};

// SI prefix words and the prefix symbols (case-sensitive) that may precede a unit word.
export const PREFIX_WORDS: Readonly<Record<string, string>> = {
  pico: 'p', nano: 'n', micro: 'u', milli: 'm', centi: 'c', kilo: 'k', mega: 'M', giga: 'G',
};
// 'K' before a word (KOHM) can only mean kilo; lower-case 'm' stays milli and upper-case 'M' stays mega.
export const PREFIX_SYMBOLS: Readonly<Record<string, string>> = {
  p: 'p', n: 'n', u: 'u', m: 'm', c: 'c', k: 'k', K: 'k', M: 'M', G: 'G',
};
