/**
 * Runs once when a server process starts: the outbox retry loop lives here, and a production
 * server warms its print pool (PRINT_WARM_UP=0 turns that off).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startMailDispatcher } = await import('@/lib/mail/outbox');
    startMailDispatcher();
    if (process.env.NODE_ENV === 'production' && process.env.PRINT_WARM_UP !== '0') {
      const { warmPrintPool } = await import('@/features/schedule/print/print-pool');
      void warmPrintPool();
    }
  }
}
