// Next.js runs register() once as each server instance starts (nextjs.org/docs/app/guides/instrumentation).
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || process.env.NEXT_PHASE === 'phase-production-build') return;
  const { warmSearchIndex } = await import('@/lib/search/search-service');
  warmSearchIndex();
}
