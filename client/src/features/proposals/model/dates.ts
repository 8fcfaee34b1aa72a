/** When something happened, in the office's words: "Dec 5, 2026, 9:41 AM" (the browser's own time zone). */
const stamp = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

export const formatStamp = (iso: string): string => stamp.format(new Date(iso));
