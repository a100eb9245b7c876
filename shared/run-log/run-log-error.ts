/**
 * Why a run log was refused: the line (1-based, as an editor shows it) and the column header when known,
 * and the reason in words. Nothing of a refused file is kept.
 */
export class RunLogParseError extends Error {
  readonly line: number | null;
  readonly column: string | null;
  readonly reason: string;

  constructor(reason: string, where: { line?: number | null; column?: string | null } = {}) {
    const line = where.line ?? null;
    const column = where.column ?? null;
    const at = [line !== null ? `line ${line}` : null, column !== null ? `column "${column}"` : null].filter(Boolean).join(', ');
    super(at ? `${at}: ${reason}` : reason);
    this.name = 'RunLogParseError';
    this.line = line;
    this.column = column;
    this.reason = reason;
  }

  toJSON(): { line: number | null; column: string | null; reason: string; message: string } {
    return { line: this.line, column: this.column, reason: this.reason, message: this.message };
  }
}
