import { describe, expect, it } from 'vitest';
import { createCallRelay, type ShellHandler } from '../../src-main/desktop/call-relay';
import type { CallResult, ServiceHost } from '../../src-main/service/contract';

// The relay's only job is routing; the service side is a recorder implementing the contract's
// `call`, so the test sees exactly what would reach the handler map.
function recordingHost() {
  const calls: Array<{ name: string; args: unknown }> = [];
  const host: Pick<ServiceHost, 'call'> = {
    async call(name, args): Promise<CallResult> {
      calls.push({ name, args });
      return { ok: true, value: `service:${name}` };
    },
  };
  return { host, calls };
}

describe('createCallRelay', () => {
  const printed: Array<{ context: string; args: unknown }> = [];
  const print: ShellHandler<string> = async (context, args) => {
    printed.push({ context, args });
    return { ok: true, value: { saved: false } };
  };

  it('passes service names and args through unchanged', async () => {
    const { host, calls } = recordingHost();
    const relay = createCallRelay(host, { 'desktop.printToPdf': print });
    const args = { partId: 'p-9', kv: 2200 };
    expect(await relay('win-1', 'parts.update', args)).toEqual({ ok: true, value: 'service:parts.update' });
    expect(calls).toEqual([{ name: 'parts.update', args }]);
  });

  it('answers desktop.printToPdf in the shell, with the caller context, without reaching the service', async () => {
    const { host, calls } = recordingHost();
    const relay = createCallRelay(host, { 'desktop.printToPdf': print });
    printed.length = 0;
    expect(await relay('win-1', 'desktop.printToPdf', { suggestedName: 'Truck 3' })).toEqual({ ok: true, value: { saved: false } });
    expect(printed).toEqual([{ context: 'win-1', args: { suggestedName: 'Truck 3' } }]);
    expect(calls).toEqual([]);
  });

  it('refuses unknown desktop names and inherited property names', async () => {
    const { host, calls } = recordingHost();
    const relay = createCallRelay(host, { 'desktop.printToPdf': print });
    for (const name of ['desktop.openDevTools', 'desktop.constructor', 'desktop.__proto__']) {
      const result = await relay('w', name, {});
      expect(result.ok, name).toBe(false);
      if (!result.ok) expect(result.error.kind).toBe('unknown-handler');
    }
    expect(calls).toEqual([]);
  });

  it.each([[undefined], [42], [''], [{ name: 'parts.list' }]])('refuses a non-string name %j, naming the field', async (name) => {
    const { host, calls } = recordingHost();
    const result = await createCallRelay(host, {})('w', name, {});
    expect(result).toMatchObject({ ok: false, error: { kind: 'invalid', field: 'name' } });
    expect(calls).toEqual([]);
  });

  it('turns a throw into a plain internal error without the stack', async () => {
    const errors: unknown[] = [];
    const failing: Pick<ServiceHost, 'call'> = {
      call: async () => {
        throw new Error('disk I/O error at /secret/path');
      },
    };
    const result = await createCallRelay(failing, {}, (error) => errors.push(error))('w', 'parts.list', {});
    expect(result).toEqual({ ok: false, error: { kind: 'internal', message: '"parts.list" failed inside the desktop shell.' } });
    expect(errors).toHaveLength(1);
  });
});
