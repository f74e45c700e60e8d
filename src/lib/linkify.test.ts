import { describe, expect, it } from 'vitest';
import { linkify } from './linkify';

describe('linkify', () => {
  it('splits an invitation line into text and its link', () => {
    const pieces = linkify('Accept here: http://127.0.0.1:3000/invitations/abc123 before Friday.');
    expect(pieces).toEqual([
      { kind: 'text', text: 'Accept here: ' },
      { kind: 'link', href: 'http://127.0.0.1:3000/invitations/abc123' },
      { kind: 'text', text: ' before Friday.' },
    ]);
  });

  it('leaves a sentence-ending full stop out of the address', () => {
    expect(linkify('Go to https://gatefold.example/reset/t0k.')).toEqual([
      { kind: 'text', text: 'Go to ' },
      { kind: 'link', href: 'https://gatefold.example/reset/t0k' },
      { kind: 'text', text: '.' },
    ]);
  });

  it('does not turn other schemes into links', () => {
    expect(linkify('javascript:alert(1) and ftp://x')).toEqual([{ kind: 'text', text: 'javascript:alert(1) and ftp://x' }]);
  });
});
