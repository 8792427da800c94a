// @vitest-environment jsdom
// DOMPurify needs a standards-conforming parser: under happy-dom it lets scripts through, so this runs under jsdom.
import { describe, expect, it } from 'vitest';
import { safeMailHtml } from './mail-html';

describe('safeMailHtml', () => {
  it('drops scripts, event handlers and javascript: links', () => {
    const out = safeMailHtml('<p onclick="steal()">Hi</p><script>steal()</script><a href="javascript:steal()">x</a>');
    expect(out).not.toMatch(/script|onclick|javascript:/i);
    expect(out).toContain('<p>Hi</p>');
  });

  it('drops style attributes and sheets, which the page policy would refuse', () => {
    const out = safeMailHtml('<style>p{color:red}</style><p style="color:red">Hi</p>');
    expect(out).toBe('<p>Hi</p>');
  });

  it('drops images, so showing a mail fetches nothing from elsewhere', () => {
    expect(safeMailHtml('<img src="https://tracker.example.test/pixel.gif">')).toBe('');
  });

  it('keeps the simple table markup our mails use, and opens their links in a new tab', () => {
    const out = safeMailHtml(
      '<table width="600" cellpadding="16"><tr><td bgcolor="#12343b"><font color="#ffffff"><b>Shop</b></font></td></tr></table>' +
        '<a href="https://shop.example.test/orders/1">View</a>',
    );
    expect(out).toContain('<td bgcolor="#12343b"><font color="#ffffff"><b>Shop</b></font></td>');
    expect(out).toContain('<a href="https://shop.example.test/orders/1" target="_blank" rel="noopener noreferrer">View</a>');
  });
});
