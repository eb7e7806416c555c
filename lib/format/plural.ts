/** A count as people read it: digits grouped in thousands (12,345), the same on the server and in the browser. */
export function formatCount(n: number): string {
  return n.toLocaleString('en');
}

export function plural(n: number, noun: string): string {
  return `${formatCount(n)} ${noun}${n === 1 ? '' : 's'}`;
}
