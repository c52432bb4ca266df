import type { EventEmitter } from 'node:events';
import { beforeAll, describe, expect, it, vi, type Mock } from 'vitest';
import type { CallResult, ServiceEvent } from '../../src-main/service/contract';

// Electron's contextBridge and ipcRenderer are OS glue; they are replaced here so the real
// preload module can run under Node and we can see exactly what it hands to the page.
const glue = vi.hoisted(() => ({
  exposed: [] as Array<{ key: string; api: unknown }>,
  emitter: undefined as EventEmitter | undefined,
  invoke: undefined as Mock | undefined,
}));

vi.mock('electron', async () => {
  const { EventEmitter: Emitter } = await import('node:events');
  const emitter = new Emitter();
  const invoke = vi.fn(async (channel: string, name: string, args: unknown) => ({ ok: true, value: { channel, name, args } }));
  glue.emitter = emitter;
  glue.invoke = invoke;
  return {
    contextBridge: {
      exposeInMainWorld: (key: string, api: unknown) => glue.exposed.push({ key, api }),
    },
    ipcRenderer: {
      invoke,
      on: (channel: string, listener: (...args: unknown[]) => void) => emitter.on(channel, listener),
      removeListener: (channel: string, listener: (...args: unknown[]) => void) => emitter.removeListener(channel, listener),
    },
  };
});

interface ExposedBridge {
  call(name: string, args: unknown): Promise<CallResult>;
  onEvent(listener: (event: ServiceEvent) => void): () => void;
}

let bridge: ExposedBridge;
let emitter: EventEmitter;

beforeAll(async () => {
  await import('../../src-main/desktop/preload');
  bridge = glue.exposed[0]?.api as ExposedBridge;
  if (!glue.emitter) throw new Error('the electron mock was not used');
  emitter = glue.emitter;
});

describe('desktop preload', () => {
  it('exposes exactly one object, named rigbook', () => {
    expect(glue.exposed.map((entry) => entry.key)).toEqual(['rigbook']);
  });

  it('gives that object only call and onEvent, both functions', () => {
    expect(Object.keys(bridge).sort()).toEqual(['call', 'onEvent']);
    expect(typeof bridge.call).toBe('function');
    expect(typeof bridge.onEvent).toBe('function');
    expect(Object.getOwnPropertySymbols(bridge)).toEqual([]);
  });

  it('sends call(name, args) on the one call channel and returns its answer', async () => {
    const args = { id: 'b-3' };
    const result = await bridge.call('builds.get', args);
    expect(glue.invoke).toHaveBeenCalledWith('rigbook:call', 'builds.get', args);
    expect(result).toEqual({ ok: true, value: { channel: 'rigbook:call', name: 'builds.get', args } });
  });

  it('hands listeners only the event, never the IPC event object', () => {
    const seen: unknown[][] = [];
    const stop = bridge.onEvent((...received: unknown[]) => seen.push(received));
    const payload: ServiceEvent = { type: 'verdicts-changed', buildIds: ['b-1', 'b-2'] };
    const ipcEvent = { sender: { send: () => {} }, senderId: 0 };
    emitter.emit('rigbook:event', ipcEvent, payload);
    expect(seen).toEqual([[payload]]);

    stop();
    emitter.emit('rigbook:event', ipcEvent, payload);
    expect(seen).toHaveLength(1);
    expect(emitter.listenerCount('rigbook:event')).toBe(0);
  });

  it('does not listen on any other channel', () => {
    const stop = bridge.onEvent(() => {});
    expect(emitter.eventNames()).toEqual(['rigbook:event']);
    stop();
  });
});
