import type { TransportDatasetDraft } from '@/lib/schema';
import { toSi, unitInfo } from '@/lib/transport/units';
import type { GeometrySummary } from './types';

type Measure = { value?: number; unit?: string } | undefined;

/** A {value, unit} from the metadata in SI, or null when absent, non-positive or in an unknown unit. */
export function siOf(measure: Measure): number | null {
  if (!measure || typeof measure.value !== 'number' || !measure.unit || !unitInfo(measure.unit)) return null;
  const v = toSi(measure.value, measure.unit);
  return Number.isFinite(v) ? v : null;
}

/** Sample geometry in SI with the cross-section from area, width × thickness, or diameter (in that order). */
export function geometryFromMetadata(metadata: TransportDatasetDraft | undefined): GeometrySummary | null {
  const g = metadata?.sample?.geometry;
  if (!g) return null;
  const lengthM = siOf(g.lengthBetweenVoltageContacts) ?? siOf(metadata?.sample?.contacts?.spacing);
  const widthM = siOf(g.width);
  const thicknessM = siOf(g.thickness);
  const diameterM = siOf(g.diameter);
  const area = siOf(g.crossSectionArea);
  let areaM2: number | null = null;
  let areaFrom: GeometrySummary['areaFrom'] = null;
  if (area !== null) [areaM2, areaFrom] = [area, 'cross-section-area'];
  else if (widthM !== null && thicknessM !== null) [areaM2, areaFrom] = [widthM * thicknessM, 'width-thickness']; // A = w·t
  else if (diameterM !== null) [areaM2, areaFrom] = [(Math.PI * diameterM * diameterM) / 4, 'diameter']; // A = πd²/4
  return { lengthM, areaM2, widthM, thicknessM, areaFrom };
}
