// A run-log file's bytes as text. Shop loggers export UTF-8 (often with a byte-order mark) or, on Windows,
// UTF-16 with its mark; anything else holding NUL bytes is not a text export and is refused.

export function decodeRunLogBytes(bytes: Uint8Array): string | null {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes);
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes);
  if (bytes.includes(0)) return null;
  return new TextDecoder('utf-8').decode(bytes);
}
