import { randomBytes } from 'node:crypto';
import fs from 'node:fs';

export interface LocalSecrets {
  sessionSecret: string;
  oidcClientSecret: string;
}

/** Secrets of a local installation, made once and kept under .data/ (git-ignored). */
export function localSecrets(file: string): LocalSecrets {
  if (!fs.existsSync(file)) {
    const fresh: LocalSecrets = {
      sessionSecret: randomBytes(32).toString('base64url'),
      oidcClientSecret: randomBytes(24).toString('base64url'),
    };
    fs.writeFileSync(file, JSON.stringify(fresh, null, 2), { mode: 0o600 });
  }
  return JSON.parse(fs.readFileSync(file, 'utf8')) as LocalSecrets;
}
