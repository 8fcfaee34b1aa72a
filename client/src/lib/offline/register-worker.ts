import { offerUpdate } from './app-update';

/**
 * Registers the service worker of a production build (the dev server and the tests have none).
 * A new build's worker waits (registerType 'prompt'); the banner offers it (app-update.tsx).
 */
export async function registerAppWorker(): Promise<void> {
  if (!import.meta.env.PROD || typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  const { registerSW } = await import('virtual:pwa-register');
  const update = registerSW({
    immediate: true,
    onNeedRefresh: () => offerUpdate(update),
    onRegisterError: () => undefined,
  });
}
