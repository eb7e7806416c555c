// A full-resolution curve as a JSON body written in slices, so millions of points never become one giant string.
import type { FullCurveResult } from './read-full-curve';

const encoder = new TextEncoder();

function slices(result: FullCurveResult, perSlice: number): Generator<string> {
  return (function* () {
    const head = { fileId: result.fileId, x: result.x, y: result.y, xUcum: result.xUcum, yUcum: result.yUcum, points: result.points };
    yield `${JSON.stringify(head).slice(0, -1)},"xs":[`;
    for (const [name, values] of [['xs', result.xs], ['ys', result.ys]] as const) {
      if (name === 'ys') yield '],"ys":[';
      // Values are finite (extractCurve keeps finite pairs), so String() is valid JSON for each.
      for (let i = 0; i < values.length; i += perSlice) yield Array.from(values.subarray(i, i + perSlice), String).join(',') + (i + perSlice < values.length ? ',' : '');
    }
    yield ']}';
  })();
}

/** { fileId, x, y, xUcum, yUcum, points, xs: [...], ys: [...] } as a pull-based byte stream. */
export function curveJsonStream(result: FullCurveResult, perSlice = 20_000): ReadableStream<Uint8Array> {
  const parts = slices(result, perSlice);
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      const next = parts.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
  });
}
