import type { RunLog } from '../../shared/run-log/index';

// The parsed series in binary for storage: a small JSON header, then time as Float64 (seconds) and each
// channel as Float32 (SI; NaN = missing). Float32 keeps ~7 significant digits: 0.0001 K at cure
// temperatures, 0.25 Pa at autoclave pressures — far below what any logger resolves.

const MAGIC = 'DFRL1';

export function packSeries(log: RunLog): Uint8Array {
  const header = new TextEncoder().encode(JSON.stringify({ rows: log.rows, channels: log.channels.map((c) => c.key) }));
  const n = log.rows;
  // magic (5) + header length (4) + header, padded to 8 bytes, then the arrays
  const headerEnd = Math.ceil((9 + header.byteLength) / 8) * 8;
  const bytes = new Uint8Array(headerEnd + n * 8 + log.channels.length * n * 4);
  bytes.set(new TextEncoder().encode(MAGIC), 0);
  new DataView(bytes.buffer).setUint32(5, header.byteLength, true);
  bytes.set(header, 9);
  new Float64Array(bytes.buffer, headerEnd, n).set(log.timeS);
  log.channels.forEach((c, k) => new Float32Array(bytes.buffer, headerEnd + n * 8 + k * n * 4, n).set(c.values));
  return bytes;
}

export function unpackSeries(bytes: Uint8Array): { timeS: Float64Array; channels: Record<string, Float32Array> } {
  const copy = new Uint8Array(bytes); // own, aligned buffer
  if (new TextDecoder().decode(copy.subarray(0, 5)) !== MAGIC) throw new Error('not a packed run-log series');
  const headerLength = new DataView(copy.buffer).getUint32(5, true);
  const header = JSON.parse(new TextDecoder().decode(copy.subarray(9, 9 + headerLength))) as { rows: number; channels: string[] };
  const headerEnd = Math.ceil((9 + headerLength) / 8) * 8;
  const n = header.rows;
  const channels: Record<string, Float32Array> = {};
  header.channels.forEach((key, k) => (channels[key] = new Float32Array(copy.buffer, headerEnd + n * 8 + k * n * 4, n)));
  return { timeS: new Float64Array(copy.buffer, headerEnd, n), channels };
}
