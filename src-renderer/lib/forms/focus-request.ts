// A link that names a field (a missing input on the build sheet) asks the form it opens to put
// the cursor there. One request at a time, taken by the first form that holds the field.

let requested: string | null = null;

export function requestFieldFocus(field: string | null): void {
  requested = field;
}

/** Focuses the requested field if this form holds it (`idPrefix-key`); returns whether it did. */
export function focusRequestedField(idPrefix: string, doc: Document = document): boolean {
  if (requested === null) return false;
  // Fields are `idPrefix-key`; a group such as the supplies is found by its data-field.
  const field = CSS.escape(requested);
  const target = doc.getElementById(`${idPrefix}-${requested}`) ?? doc.querySelector<HTMLElement>(`[data-field="${field}"] input, [data-field="${field}"] select`);
  if (!target) return false;
  requested = null;
  target.focus();
  target.scrollIntoView({ block: 'center' });
  return true;
}
