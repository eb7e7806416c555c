// Structured JSON logs, one object a line. Keys that could hold secrets are masked before writing.
type Level = 'debug' | 'info' | 'warn' | 'error';
const ORDER: Record<Level, number> = { debug: 10, info: 20, warn: 30, error: 40 };
const SECRET_KEY = /pass(word)?|secret|token|authorization|cookie/i;

function redact(fields: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(fields).map(([k, v]) => [k, SECRET_KEY.test(k) ? '[redacted]' : v]));
}

export function log(level: Level, msg: string, fields: Record<string, unknown> = {}): void {
  const threshold = (process.env.LOG_LEVEL as Level | undefined) ?? 'info';
  if (ORDER[level] < ORDER[threshold]) return;
  const line = JSON.stringify({ time: new Date().toISOString(), level, msg, ...redact(fields) });
  if (level === 'error' || level === 'warn') console.error(line);
  else console.log(line);
}
