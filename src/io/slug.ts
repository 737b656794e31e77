/** A file-name-friendly form of a name: `SELVA follow-up 2027A` → `selva-follow-up-2027a`. */
export function slug(name: string): string {
  return (
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '') || 'campaign'
  );
}
