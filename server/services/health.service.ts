export interface HealthReport {
  status: 'ok' | 'degraded';
  db: 'up' | 'down';
  version: string;
}

/**
 * Asks the database to answer and reports honestly. The ping is raced against
 * a timeout so a hung connection reads as "down" instead of hanging the probe.
 * Returns the HTTP status to use: 503 whenever the database is down.
 */
export async function checkHealth(
  pingDatabase: () => Promise<unknown>,
  version: string,
  timeoutMs = 2_000,
): Promise<{ httpStatus: 200 | 503; body: HealthReport }> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error('database ping timed out')), timeoutMs);
  });
  try {
    await Promise.race([pingDatabase(), timeout]);
    return { httpStatus: 200, body: { status: 'ok', db: 'up', version } };
  } catch {
    return { httpStatus: 503, body: { status: 'degraded', db: 'down', version } };
  } finally {
    clearTimeout(timer);
  }
}
