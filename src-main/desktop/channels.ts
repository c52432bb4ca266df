// The only IPC channels between the desktop main process and the renderer.
export const CALL_CHANNEL = 'rigbook:call';
export const EVENT_CHANNEL = 'rigbook:event';
