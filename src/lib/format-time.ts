/** A moment for people, in their own locale: "1 Dec 2026, 22:20"; a dash when there is none. */
export const fmtTime = (iso: string | null) => (iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : '—');

/** An ISO stamp cut to its date and minute, as stored ("2026-11-30 07:42"): no conversion to the reader's zone. */
export const fmtStamp = (iso: string) => iso.replace('T', ' ').slice(0, 16);
