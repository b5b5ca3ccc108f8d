/**
 * The name a file is recorded under. Names are only ever labels (files are stored by content),
 * but a name that climbs out of its folder (`../`) or is an absolute path (`/etc/x`, `C:\x`) says
 * nothing true about the data and would mislead anyone who later unpacks an export by it: such a
 * name is kept as its last part. Ordinary relative paths (`night1/obj.fits` inside an archive)
 * stay as they are. Backslashes count as separators, as Windows tools write them.
 *
 * @example safeFileName('../../etc/passwd') === 'passwd'
 */
export function safeFileName(name: string): string {
  const slashed = name.replace(/\\/g, '/');
  const parts = slashed.split('/');
  const climbs = parts.includes('..');
  const absolute = slashed.startsWith('/') || /^[A-Za-z]:\//.test(slashed);
  if (!climbs && !absolute) return name;
  const base = parts.filter((p) => p !== '' && p !== '.' && p !== '..').pop();
  return base ?? 'unnamed';
}
