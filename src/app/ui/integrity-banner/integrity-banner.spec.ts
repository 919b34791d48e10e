import { TestBed } from '@angular/core/testing';
import { IntegrityBanner } from './integrity-banner';

describe('IntegrityBanner', () => {
  async function render(integrity: { ok: boolean; problems: string[] } | undefined) {
    const fixture = TestBed.createComponent(IntegrityBanner);
    fixture.componentRef.setInput('integrity', integrity);
    fixture.componentRef.setInput('label', 'Version 2');
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('shows nothing for a version that passes, or when the server sent no check', async () => {
    expect((await render({ ok: true, problems: [] })).querySelector('[data-testid="integrity-failed"]')).toBeNull();
    expect((await render(undefined)).querySelector('[data-testid="integrity-failed"]')).toBeNull();
  });

  it('raises an alert naming the version and every problem the server found', async () => {
    const root = await render({ ok: false, problems: ["Petra Approver's signature binds content 1f2e…, not the content stored now (9a8b…)."] });
    const alert = root.querySelector('[data-testid="integrity-failed"]')!;
    expect(alert.getAttribute('role')).toBe('alert');
    expect(alert.textContent).toContain('Version 2 fails its integrity check — do not use it.');
    expect(alert.textContent).toContain("Petra Approver's signature binds content 1f2e…");
  });
});
