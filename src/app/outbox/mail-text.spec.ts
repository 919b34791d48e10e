import { mailTextLines } from './mail-text';

describe('mailTextLines', () => {
  const origin = 'http://localhost:4200';

  it('keeps plain lines as text', () => {
    expect(mailTextLines('Hello Naoko,\n\nWelcome.', origin)).toEqual([[{ text: 'Hello Naoko,' }], [{ text: '' }], [{ text: 'Welcome.' }]]);
  });

  it("links addresses on the page's own origin as paths, without the sentence's full stop", () => {
    const [line] = mailTextLines('Open http://localhost:4200/set-password?token=abc_DEF-1. It works once.', origin);
    expect(line).toEqual([
      { text: 'Open ' },
      { text: 'http://localhost:4200/set-password?token=abc_DEF-1', href: '/set-password?token=abc_DEF-1' },
      { text: '. It works once.' },
    ]);
  });

  it('links relative paths', () => {
    expect(mailTextLines('Settings: /account', origin)).toEqual([[{ text: 'Settings: ' }, { text: '/account', href: '/account' }]]);
  });

  it('leaves addresses elsewhere as text', () => {
    expect(mailTextLines('See https://elsewhere.example/x and //evil.example/y', origin)).toEqual([
      [{ text: 'See https://elsewhere.example/x and //evil.example/y' }],
    ]);
  });

  it('does not take a look-alike origin for its own', () => {
    expect(mailTextLines('http://localhost:4200.evil.example/a', origin)[0].every((p) => !p.href)).toBe(true);
  });
});
