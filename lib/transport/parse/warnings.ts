import type { ParseWarning, ParseWarningCode } from './types';

/** Keeps the first `perCode` warnings of each kind and counts the rest, so a bad million-row file stays readable. */
export class WarningLog {
  private readonly list: ParseWarning[] = [];
  private readonly counts = new Map<ParseWarningCode, number>();
  private readonly firstLine = new Map<ParseWarningCode, number>();

  constructor(private readonly perCode = 20) {}

  add(w: ParseWarning): void {
    const n = (this.counts.get(w.code) ?? 0) + 1;
    this.counts.set(w.code, n);
    if (n <= this.perCode) this.list.push(w);
    else if (!this.firstLine.has(w.code)) this.firstLine.set(w.code, w.line);
  }

  count(code: ParseWarningCode): number {
    return this.counts.get(code) ?? 0;
  }

  result(): ParseWarning[] {
    const extra: ParseWarning[] = [];
    for (const [code, n] of this.counts) {
      if (n > this.perCode) {
        extra.push({
          line: this.firstLine.get(code) ?? 0,
          code: 'more-warnings',
          message: `${n - this.perCode} more '${code}' warnings (${n} in all), the first of them on line ${this.firstLine.get(code)}.`,
        });
      }
    }
    return [...this.list, ...extra];
  }
}
