// Saving an export: a Blob offered as a download (nothing leaves the browser), and an SVG rasterised for PNG.

export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Revoke after the click has been handled; an immediate revoke can cancel the download in some browsers.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** The SVG drawn onto a canvas at `scale` × its size, as PNG (the SVG is self-contained, so the canvas stays clean). */
export async function svgToPng(svg: string, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.decoding = 'async';
    img.src = url;
    await img.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(img.naturalWidth * scale);
    canvas.height = Math.round(img.naturalHeight * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('this browser cannot draw on a canvas');
    ctx.scale(scale, scale);
    ctx.drawImage(img, 0, 0);
    return await new Promise<Blob>((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the PNG could not be encoded'))), 'image/png'));
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** 'ohmstead-compare-2026-12-03' in the viewer's calendar. */
export function exportBaseName(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `ohmstead-compare-${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
