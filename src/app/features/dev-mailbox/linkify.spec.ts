import { linkify } from './linkify';

describe('linkify', () => {
  it('turns http(s) addresses into links and keeps the rest as text', () => {
    expect(linkify('Open http://127.0.0.1:3000/join?token=abc. Then sign in.')).toEqual([
      { text: 'Open ' },
      { text: 'http://127.0.0.1:3000/join?token=abc', href: 'http://127.0.0.1:3000/join?token=abc' },
      { text: '. Then sign in.' },
    ]);
  });

  it('never links other schemes', () => {
    expect(linkify('javascript:alert(1) data:text/html,x')).toEqual([{ text: 'javascript:alert(1) data:text/html,x' }]);
  });
});
