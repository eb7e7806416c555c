import type { UploadApi } from './api-client';
import { retryDelayMs, type RetryPolicy, type Sleep } from './backoff';
import type { AnalysisResponse } from './types';
import { isRetryable } from './upload-errors';

/** The worker writes progress at most once a second (lib/analysis, lib/uploads); asking faster gains nothing. */
export const ANALYSIS_POLL_MS = 1500;

/**
 * Asks GET /api/v1/files/:id/analysis until the analysis is no longer queued or running, reporting each answer.
 * Passing failures (network, 5xx) are retried with backoff; `retry.maxAttempts` failures in a row give up.
 */
export async function pollAnalysis(opts: {
  api: Pick<UploadApi, 'getAnalysis'>;
  fileId: string;
  signal: AbortSignal;
  sleep: Sleep;
  retry: RetryPolicy;
  intervalMs?: number;
  onUpdate: (analysis: AnalysisResponse) => void;
}): Promise<AnalysisResponse> {
  let failures = 0;
  for (;;) {
    try {
      const analysis = await opts.api.getAnalysis(opts.fileId, opts.signal);
      failures = 0;
      opts.onUpdate(analysis);
      if (analysis.state !== 'queued' && analysis.state !== 'running') return analysis;
      await opts.sleep(opts.intervalMs ?? ANALYSIS_POLL_MS, opts.signal);
    } catch (err) {
      if (opts.signal.aborted) throw opts.signal.reason;
      failures += 1;
      if (!isRetryable(err) || failures >= opts.retry.maxAttempts) throw err;
      await opts.sleep(retryDelayMs(failures, opts.retry), opts.signal);
    }
  }
}
