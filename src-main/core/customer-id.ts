// The customer an owner text becomes, when a vehicle written before customers were records
// names its owner as text. The store's upgrade derived ids the same way (its migration holds a
// frozen copy), so an old file imported after the upgrade meets the customers it made.

/** FNV-1a over the UTF-16 code units, 32 bits, as 8 hex digits: a short stable tag of the owner text. */
function textTag(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

/** Readable where the text is, unique by its tag: "Dana Ó Briain" → "cust-dana-o-briain-1a2b3c4d". The text is trimmed first. */
export function customerIdForOwner(ownerText: string): string {
  const owner = ownerText.trim();
  const slug = owner
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '');
  return `cust-${slug === '' ? '' : `${slug}-`}${textTag(owner)}`;
}
