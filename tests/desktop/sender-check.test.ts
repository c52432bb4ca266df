import { describe, expect, it } from 'vitest';
import { isTrustedSender } from '../../src-main/desktop/sender-check';

// Electron's IPC docs advise checking event.senderFrame on every handled message (from memory).
describe('isTrustedSender', () => {
  const top = (url: string) => ({ url, parent: null });

  it('accepts the top frame of our page', () => {
    expect(isTrustedSender(top('app://rigbook/index.html'))).toBe(true);
    expect(isTrustedSender(top('app://rigbook/builds?id=b-7'))).toBe(true);
  });

  it('refuses a missing frame (destroyed or navigated away)', () => {
    expect(isTrustedSender(null)).toBe(false);
    expect(isTrustedSender(undefined)).toBe(false);
  });

  it('refuses a child frame even on our origin', () => {
    expect(isTrustedSender({ url: 'app://rigbook/index.html', parent: top('app://rigbook/index.html') })).toBe(false);
  });

  it.each(['app://rigbook.evil/index.html', 'app://rigbook@evil/', 'app://evil/rigbook', 'file:///tmp/index.html', 'https://rigbook/', 'about:blank', ''])('refuses a top frame on %s', (url) => {
    expect(isTrustedSender(top(url))).toBe(false);
  });
});
