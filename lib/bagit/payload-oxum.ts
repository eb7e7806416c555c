// Payload-Oxum (RFC 8493 §2.2.2): "OctetCount.StreamCount" of the payload, a quick completeness check before hashing.

export type PayloadOxum = { octets: number; streams: number };

export function formatPayloadOxum(octets: number, streams: number): string {
  if (!Number.isSafeInteger(octets) || octets < 0 || !Number.isSafeInteger(streams) || streams < 0)
    throw new RangeError(`Payload-Oxum needs two non-negative integers, got ${octets} and ${streams}`);
  return `${octets}.${streams}`;
}

/** The two counts, or undefined when the value is not two decimal integers joined by one ".". */
export function parsePayloadOxum(value: string): PayloadOxum | undefined {
  const m = /^(\d+)\.(\d+)$/.exec(value);
  if (!m) return undefined;
  const octets = Number(m[1]);
  const streams = Number(m[2]);
  if (!Number.isSafeInteger(octets) || !Number.isSafeInteger(streams)) return undefined;
  return { octets, streams };
}

/** Problems (empty when the value matches) comparing a Payload-Oxum value with the payload actually present. */
export function checkPayloadOxum(value: string, actual: PayloadOxum): string[] {
  const declared = parsePayloadOxum(value);
  if (!declared) return [`bag-info.txt: Payload-Oxum "${value}" is not of the form OctetCount.StreamCount`];
  const problems: string[] = [];
  if (declared.octets !== actual.octets)
    problems.push(`bag-info.txt: Payload-Oxum declares ${declared.octets} payload bytes, the payload has ${actual.octets}`);
  if (declared.streams !== actual.streams)
    problems.push(`bag-info.txt: Payload-Oxum declares ${declared.streams} payload files, the payload has ${actual.streams}`);
  return problems;
}
