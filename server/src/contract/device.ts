/**
 * The device a change was made on: an opaque label each browser makes for itself once (random letters and
 * digits, nothing about the device), sent with every write as `X-Gaugeline-Device` and kept with the
 * record the write changed, so a conflict can say "changed on another device" (or "on this device", for
 * an edit from another tab). Zod-free: the first chunk's api client reads it.
 */
export const DEVICE_HEADER = 'X-Gaugeline-Device';

/** What the server accepts as a device label (the migration's CHECK repeats it); anything else is a 400. */
export const DEVICE_LABEL_PATTERN = /^[A-Za-z0-9-]{8,40}$/;
