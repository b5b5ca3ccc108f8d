import type { Config } from '../config';

/**
 * The address people reach Redward at, for links in e-mails. Taken from configuration, never
 * from the request's Host header, which a client could forge.
 */
export function appUrl(config: Config): string {
  return config.publicUrl ?? `http://localhost:${config.port}`;
}
