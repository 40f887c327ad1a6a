/** Runs once when a server process starts: the outbox retry loop lives here. */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startMailDispatcher } = await import('@/lib/mail/outbox');
    startMailDispatcher();
  }
}
