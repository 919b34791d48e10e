import { Component, signal } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MarkdownView, renderMarkdown } from './markdown-view';

@Component({
  imports: [MarkdownView],
  template: `<kb-markdown-view [markdown]="source()" />`,
})
class Host {
  readonly source = signal('');
}

describe('MarkdownView', () => {
  let fixture: ComponentFixture<Host>;
  let alert: ReturnType<typeof vi.fn>;

  beforeEach(() => {
    alert = vi.fn();
    vi.stubGlobal('alert', alert);
    fixture = TestBed.createComponent(Host);
  });

  afterEach(() => vi.unstubAllGlobals());

  async function show(markdown: string): Promise<HTMLElement> {
    fixture.componentInstance.source.set(markdown);
    await fixture.whenStable();
    return fixture.nativeElement.querySelector('.kb-markdown') as HTMLElement;
  }

  it('renders Markdown: numbered steps, emphasis and a web link', async () => {
    const root = await show('1. Clamp **both** sides\n2. Close the hood\n\nSee [the manual](https://lab.example/manual).');
    expect(root.querySelectorAll('ol > li').length).toBe(2);
    expect(root.querySelector('strong')?.textContent).toBe('both');
    const link = root.querySelector('a')!;
    expect(link.getAttribute('href')).toBe('https://lab.example/manual');
    expect(link.getAttribute('rel')).toBe('noopener noreferrer');
  });

  it('shows a script tag as the text it is, never as a script', async () => {
    const source = 'Before\n\n<script>alert(1)</script>\n\nAfter';
    // The sanitized string itself is clean, not only what Angular's own sanitizer lets into the DOM.
    expect(renderMarkdown(source)).not.toMatch(/<script/i);
    const root = await show(source);
    expect(root.querySelector('script')).toBeNull();
    expect(root.textContent).toContain('<script>alert(1)</script>');
    expect(root.textContent).toContain('Before');
    expect(root.textContent).toContain('After');
    expect(alert).not.toHaveBeenCalled();
  });

  it('shows raw HTML with event handlers as text: no element, no handler', async () => {
    const source = '<img src=x onerror=alert(1)> and <b onclick="alert(2)">bold</b>';
    expect(renderMarkdown(source)).not.toMatch(/<(img|b)\b/i);
    const root = await show(source);
    expect(root.querySelector('img, b, [onerror], [onclick]')).toBeNull();
    expect(root.textContent).toContain('<img src=x onerror=alert(1)> and <b onclick="alert(2)">bold</b>');
    expect(alert).not.toHaveBeenCalled();
  });

  it('makes javascript: links inert', async () => {
    const source = '[x](javascript:alert(1)) and <a href="JaVaScRiPt:alert(2)">y</a> and <a href="data:text/html,hi">z</a>';
    expect(renderMarkdown(source)).not.toMatch(/<a [^>]*href="(javascript|data):/i);
    const root = await show(source);
    const hrefs = [...root.querySelectorAll('a')].map((a) => a.getAttribute('href'));
    for (const href of hrefs) expect(href ?? '').not.toMatch(/^\s*(javascript|data):/i);
    root.querySelectorAll('a').forEach((a) => a.click());
    expect(alert).not.toHaveBeenCalled();
  });

  it('removes style, iframe and form elements', async () => {
    const source =
      '<style>body{display:none}</style><iframe src="https://evil.example"></iframe><form action="/x"><input name="p"><button>Go</button></form>text';
    expect(renderMarkdown(source)).not.toMatch(/<(style|iframe|form|input|button)/i);
    const root = await show(source);
    expect(root.querySelector('style, iframe, form, input, button')).toBeNull();
    expect(root.textContent).toContain('text');
  });

  it('keeps relative and mail links, and leaves an empty source empty', () => {
    const html = renderMarkdown('[sheet](/recipes/4) [mail](mailto:lab@example.com)');
    expect(html).toContain('href="/recipes/4"');
    expect(html).toContain('href="mailto:lab@example.com"');
    expect(renderMarkdown('')).toBe('');
  });
});
