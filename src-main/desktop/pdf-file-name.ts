// A file name proposed in the save dialog for a printed build sheet. The name comes from the
// renderer, so it is treated as text for a label, never as a path.
const FALLBACK = 'build-sheet';
const MAX_STEM = 100;

export function pdfFileName(suggested: string | undefined): string {
  const cleaned = (suggested ?? '')
    .replace(/[\u0000-\u001f\u007f<>:"/\\|?*]+/g, '-')
    .replace(/\s+/g, ' ')
    .replace(/\.pdf$/i, '')
    .replace(/^[\s.-]+|[\s.]+$/g, '');
  const stem = (cleaned === '' ? FALLBACK : cleaned).slice(0, MAX_STEM).trimEnd();
  return `${stem}.pdf`;
}
