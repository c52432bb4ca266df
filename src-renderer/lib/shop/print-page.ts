import { asApiError, type Client } from '../api/client';

/**
 * In the desktop shell, a PDF through the shell's own call (it opens the save dialog); in a
 * browser, the print dialog, where "Save as PDF" is one of the printers. Returns what to tell
 * the person, or null.
 */
export async function printPage(client: Client, suggestedName: string): Promise<string | null> {
  if (client.kind !== 'desktop') {
    window.print();
    return null;
  }
  try {
    const result = await client.call('desktop.printToPdf', { suggestedName });
    return result.saved && result.path ? `Saved ${result.path}` : null;
  } catch (error) {
    return asApiError(error).message;
  }
}
