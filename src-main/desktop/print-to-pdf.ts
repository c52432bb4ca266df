import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { app, BrowserWindow, dialog, type WebContents } from 'electron';
import * as v from 'valibot';
import type { CallResult } from '../service/contract';
import type { ShellCalls } from '../service/bridge-api';
import { pdfFileName } from './pdf-file-name';
import { storeFileClash } from '../store/file-identity';

export const PRINT_TO_PDF = 'desktop.printToPdf' satisfies keyof ShellCalls;
type PrintResult = ShellCalls[typeof PRINT_TO_PDF]['output'];

const PrintArgs = v.optional(
  v.object({
    suggestedName: v.optional(v.pipe(v.string('suggestedName must be text'), v.maxLength(200, 'suggestedName must be at most 200 characters'))),
    landscape: v.optional(v.boolean('landscape must be true or false')),
  }),
);

export interface ShellCallContext {
  sender: WebContents;
  /** The open store, which no file the shell writes may replace. */
  storePath: string;
}

/** `desktop.printToPdf`: asks where to save, then writes the current page as a PDF. */
export async function printToPdf(context: ShellCallContext, args: unknown): Promise<CallResult> {
  const parsed = v.safeParse(PrintArgs, args);
  if (!parsed.success) {
    const issue = parsed.issues[0];
    const field = issue ? (v.getDotPath(issue) ?? undefined) : undefined;
    return { ok: false, error: { kind: 'invalid', message: issue?.message ?? 'Invalid print options', ...(field ? { field } : {}) } };
  }
  const options = parsed.output ?? {};
  const owner = BrowserWindow.fromWebContents(context.sender);
  const dialogOptions = {
    title: 'Save build sheet as PDF',
    defaultPath: join(app.getPath('documents'), pdfFileName(options.suggestedName)),
    filters: [{ name: 'PDF', extensions: ['pdf'] }],
  };
  const choice = owner ? await dialog.showSaveDialog(owner, dialogOptions) : await dialog.showSaveDialog(dialogOptions);
  if (choice.canceled || !choice.filePath) return { ok: true, value: { saved: false } satisfies PrintResult };

  const clash = storeFileClash(choice.filePath, context.storePath);
  if (clash) return { ok: false, error: { kind: 'invalid', message: `${choice.filePath} ${clash}; the build sheet was not saved. Choose another file.` } };
  const pdf = await context.sender.printToPDF({ printBackground: true, pageSize: 'A4', landscape: options.landscape ?? false });
  await writeFile(choice.filePath, pdf);
  return { ok: true, value: { saved: true, path: choice.filePath } satisfies PrintResult };
}
