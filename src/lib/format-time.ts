/** A moment for people, in their own locale: "1 Dec 2026, 22:20"; a dash when there is none. */
export const fmtTime = (iso: string | null) => (iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : '—');
