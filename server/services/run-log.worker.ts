/**
 * One-shot worker thread: reads, checks and replays one run log (shared/run-log analyseRunLog), so a
 * 50 MB file and two solver runs never block the server's event loop. Replies with the JSON record and the
 * parsed series packed as binary, or with the reason the file was refused.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyseRunLog, RunLogParseError, type AnalyseInput } from '../../shared/run-log/index';
import { packSeries } from './run-log-series';
import { decodeRunLogBytes } from './run-log-text';

type Input = Omit<AnalyseInput, 'text'> & { bytes: Uint8Array };

try {
  const { bytes, ...rest } = workerData as Input;
  const text = decodeRunLogBytes(bytes) ?? ''; // the service refused non-text files before sending them here
  const { record, log } = analyseRunLog({ ...rest, text, parse: { byteLength: bytes.byteLength } });
  const series = packSeries(log);
  parentPort!.postMessage({ ok: true, record, series }, [series.buffer as ArrayBuffer]);
} catch (err) {
  if (err instanceof RunLogParseError) parentPort!.postMessage({ ok: false, refusal: err.toJSON() });
  else parentPort!.postMessage({ ok: false, error: (err as Error).message ?? String(err) });
}
