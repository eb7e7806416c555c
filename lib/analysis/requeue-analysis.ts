import 'server-only';
import { requeueVersionFiles } from './repo';

/** After the column mapping, sample or measurement changed: the worker summarises the version's files again. */
export async function requeueAnalysis(versionId: string): Promise<number> {
  return requeueVersionFiles(versionId);
}
