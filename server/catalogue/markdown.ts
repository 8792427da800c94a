import MarkdownIt from 'markdown-it';

// html: false escapes any raw HTML, and markdown-it's link check drops javascript: and data: URLs.
const md = new MarkdownIt({ html: false, linkify: true, typographer: false });

/** Product descriptions as HTML that is safe to put in the page with v-html. */
export function renderMarkdown(source: string): string {
  return md.render(source);
}
