/**
 * Local secrets for development and the demo, generated once and kept in the
 * data directory (never committed). Production takes every secret from the
 * environment instead.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';

export interface DevSecrets {
  sessionSecret: string;
  oidcClientSecret: string;
}

export function loadDevSecrets(dataDir: string): DevSecrets {
  const file = path.join(dataDir, 'dev-secrets.json');
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8')) as DevSecrets;
  mkdirSync(dataDir, { recursive: true });
  const secrets = { sessionSecret: randomBytes(32).toString('base64url'), oidcClientSecret: randomBytes(24).toString('base64url') };
  writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  return secrets;
}
