import type { MenuItemConstructorOptions } from 'electron';

export interface MenuActions {
  backUp(): void;
  importFleet(): void;
  exportFleet(): void;
  about(): void;
}

/** The application menu: only what the desktop shell adds; everything else is in the page. */
export function menuTemplate(actions: MenuActions, platform: NodeJS.Platform = process.platform): MenuItemConstructorOptions[] {
  const template: MenuItemConstructorOptions[] = [
    {
      label: 'File',
      submenu: [
        { label: 'Import fleet file…', click: () => actions.importFleet() },
        { label: 'Export fleet file…', click: () => actions.exportFleet() },
        { type: 'separator' },
        { label: 'Back up…', accelerator: 'CmdOrCtrl+Shift+B', click: () => actions.backUp() },
        { type: 'separator' },
        { label: 'Quit', role: 'quit' },
      ],
    },
    {
      label: 'View',
      submenu: [
        { label: 'Reload', role: 'reload' },
        { label: 'Toggle full screen', role: 'togglefullscreen' },
      ],
    },
    {
      label: 'Help',
      submenu: [{ label: 'About Rigbook', click: () => actions.about() }],
    },
  ];
  // On macOS the first menu sits under the app's name, and copy/paste shortcuts in text
  // fields only work when an Edit menu exists.
  if (platform === 'darwin') template.splice(0, 0, { role: 'appMenu' });
  if (platform === 'darwin') template.splice(2, 0, { role: 'editMenu' });
  return template;
}
