import { DEVICE_LABEL_PATTERN } from '@contract';

const KEY = 'gaugeline-device';
let label: string | null = null;

function make(): string {
  const bytes = new Uint8Array(8);
  crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * This browser's device label (contract/device.ts): 16 random hex digits made once and kept in
 * localStorage, sent with every write so the record remembers where it was changed. It says nothing about
 * the device; its one use is telling "this device" from "another device" when a conflict is shown.
 */
export function deviceLabel(): string {
  if (label) return label;
  try {
    const saved = localStorage.getItem(KEY);
    if (saved && DEVICE_LABEL_PATTERN.test(saved)) return (label = saved);
    label = make();
    localStorage.setItem(KEY, label);
  } catch {
    // Storage refused (private mode, quota): a label for this page's life still tells devices apart.
    label ??= make();
  }
  return label;
}
