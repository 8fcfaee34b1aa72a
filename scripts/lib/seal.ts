import { ensureLocalSealCertificate, LOCAL_SEAL_PASSPHRASE } from '../../server/src/services/seal-certificate';
import { log } from './system';

/**
 * The sealing certificate for a laptop: the configured SEAL_P12_FILE when there is one, otherwise a
 * self-signed one made once under .data/seal (git-ignored). Signed proposals' PDFs are sealed with it.
 */
export async function localSeal(
  env: NodeJS.ProcessEnv,
): Promise<{ SEAL_P12_FILE: string; SEAL_P12_PASSPHRASE: string }> {
  if (env.SEAL_P12_FILE)
    return { SEAL_P12_FILE: env.SEAL_P12_FILE, SEAL_P12_PASSPHRASE: env.SEAL_P12_PASSPHRASE ?? '' };
  const file = await ensureLocalSealCertificate();
  log(`signed proposals are sealed with the local self-signed certificate ${file}`);
  return { SEAL_P12_FILE: file, SEAL_P12_PASSPHRASE: LOCAL_SEAL_PASSPHRASE };
}
