/** Single-quotes a word for POSIX shells: a quote inside is closed, escaped and reopened ('it'\''s). */
export const shellQuote = (text: string): string => `'${text.replace(/'/g, `'\\''`)}'`;
