import DOMPurify from 'dompurify';

/**
 * Makes a captured mail's HTML safe to show inside the app: no scripts, handlers or forms, and no style attributes or
 * sheets (the page's Content-Security-Policy refuses them); links open in a new tab without access to this one.
 */
export function safeMailHtml(html: string): string {
  const purify = DOMPurify(window);
  purify.addHook('afterSanitizeAttributes', (node) => {
    if (node.tagName === 'A') {
      node.setAttribute('target', '_blank');
      node.setAttribute('rel', 'noopener noreferrer');
    }
  });
  return purify.sanitize(html, {
    FORBID_TAGS: ['style', 'form', 'input', 'button', 'textarea', 'select', 'img', 'video', 'audio', 'iframe'],
    FORBID_ATTR: ['style'],
    ADD_ATTR: ['target'],
  });
}
