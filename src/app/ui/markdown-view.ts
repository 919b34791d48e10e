import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import DOMPurify, { type Config } from 'dompurify';
import { Marked } from 'marked';

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);

/**
 * Our own marked instance, so no other code can change how recipes render. GitHub-flavoured,
 * synchronous. HTML typed into the Markdown is shown as the text it is, as the bench sheet
 * prints it: recipes need none, and an element with an event handler would make the browser
 * report a CSP violation even while being sanitized in an inert document.
 */
const markdownParser = new Marked({ gfm: true, breaks: false, async: false, renderer: { html: ({ text }) => escapeHtml(text) } });

/**
 * Only web, mail and relative links (and image sources). Anything else — javascript:, data:,
 * vbscript:, file: — is dropped by DOMPurify. Same shape as DOMPurify's default pattern,
 * with the scheme list cut down.
 */
const SAFE_URI = /^(?:(?:https?|mailto):|[^a-z]|[a-z+.-]+(?:[^a-z+.\-:]|$))/i;

const PURIFY_CONFIG: Config = {
  // Nothing that runs code, styles the page, embeds another page or collects input.
  FORBID_TAGS: [
    'script',
    'style',
    'iframe',
    'frame',
    'frameset',
    'object',
    'embed',
    'link',
    'meta',
    'base',
    'form',
    'input',
    'button',
    'select',
    'option',
    'textarea',
    'svg',
    'math',
  ],
  FORBID_ATTR: ['style', 'srcset', 'formaction', 'action'],
  ALLOW_DATA_ATTR: false,
  ALLOWED_URI_REGEXP: SAFE_URI,
};

/** A private DOMPurify instance: its link hook must not leak into any other caller. */
const purifier = typeof window === 'undefined' ? null : DOMPurify(window);
purifier?.addHook('afterSanitizeAttributes', (node) => {
  if (node.tagName === 'A' && node.hasAttribute('href')) {
    node.setAttribute('rel', 'noopener noreferrer');
    if (/^https?:/i.test(node.getAttribute('href') ?? '')) node.setAttribute('target', '_blank');
  }
});

/**
 * Markdown → sanitized HTML. Every piece of Markdown the app shows (instructions, acceptance
 * criteria, cautions) goes through here: marked turns it into HTML (typed HTML stays text),
 * DOMPurify strips scripts, event handlers and unsafe links. Angular's own sanitizer then sees it again in [innerHTML].
 */
export function renderMarkdown(markdown: string): string {
  if (!purifier) return '';
  const html = markdownParser.parse(markdown ?? '', { async: false });
  return purifier.sanitize(html, PURIFY_CONFIG);
}

/** Shows a piece of recipe Markdown, sanitized. */
@Component({
  selector: 'kb-markdown-view',
  template: `<div class="kb-markdown" [innerHTML]="html()"></div>`,
  styles: `
    :host {
      display: block;
    }
    .kb-markdown {
      overflow-wrap: anywhere;
      :first-child {
        margin-top: 0;
      }
      :last-child {
        margin-bottom: 0;
      }
      h1,
      h2,
      h3,
      h4 {
        font: var(--mat-sys-title-medium);
        margin: 1em 0 0.4em;
      }
      ol,
      ul {
        padding-left: 1.4em;
      }
      li + li {
        margin-top: 0.25em;
      }
      img {
        max-width: 100%;
        height: auto;
      }
      code {
        font-family: 'Roboto Mono', ui-monospace, monospace;
        font-size: 0.92em;
      }
      blockquote {
        margin: 0.6em 0;
        padding-left: 12px;
        border-left: 3px solid var(--mat-sys-outline-variant);
        color: var(--mat-sys-on-surface-variant);
      }
      table {
        border-collapse: collapse;
      }
      th,
      td {
        border: 1px solid var(--mat-sys-outline-variant);
        padding: 4px 8px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarkdownView {
  /** The Markdown source; empty renders nothing. */
  readonly markdown = input<string>('');

  protected readonly html = computed(() => renderMarkdown(this.markdown()));
}
