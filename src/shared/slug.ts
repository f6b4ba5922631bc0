/** A URL slug from a title: lower-case ASCII letters, digits and single dashes ("1976 Pipit — Brakes!" → "1976-pipit-brakes"). */
export function slugify(title: string, maxLength = 60): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/&/g, ' and ')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, maxLength)
    .replace(/-+$/g, '');
  return slug || 'untitled';
}
