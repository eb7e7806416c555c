// Paths inside a bag as manifests and fetch.txt write them (RFC 8493 §2.1.3, §2.2.3). Pure: no file system.

/** RFC 8493 §2.1.3: CR, LF and "%" (and only those) are percent-encoded in manifest and fetch paths. */
export function encodeBagPath(path: string): string {
  return path.replace(/[%\r\n]/g, (c) => (c === '%' ? '%25' : c === '\r' ? '%0D' : '%0A'));
}

/** The inverse of encodeBagPath: only %0A, %0D and %25 (either hex case) are decoded; any other "%" stays as written. */
export function decodeBagPath(encoded: string): string {
  return encoded.replace(/%(0A|0D|25)/gi, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

/** A "%" that is not the start of %0A, %0D or %25: RFC 8493 says a literal "%" must have been written as %25. */
export function hasBarePercent(encoded: string): boolean {
  return /%(?!0A|0D|25)/i.test(encoded);
}

/**
 * Why a manifest path cannot name a file inside the bag, or undefined when it can: paths are relative, "/"-separated,
 * with no empty, "." or ".." segment (so nothing escapes the bag's base directory).
 */
export function unsafeBagPathReason(path: string): string | undefined {
  if (path === '') return 'is empty';
  if (path.includes('\u0000')) return 'contains a NUL character';
  if (path.startsWith('/') || /^[A-Za-z]:[\\/]/.test(path) || path.startsWith('\\\\')) return 'is absolute';
  const segments = path.split('/');
  if (segments.includes('..')) return 'escapes the bag with ".."';
  if (segments.includes('.')) return 'contains a "." segment';
  if (segments.includes('')) return 'contains an empty segment ("//" or a trailing "/")';
  return undefined;
}

/** A path for a one-line message: as is when printable, JSON-quoted when it holds control characters. */
export function showPath(path: string): string {
  return /[\u0000-\u001F\u007F]/.test(path) ? JSON.stringify(path) : path;
}
