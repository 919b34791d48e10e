import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { RecipeVersionDto, VersionWorkflowDto } from '@shared/recipe-types';
import type { Role } from '@shared/roles';
import { aRecipeVersion } from '../../../testing/stock-and-recipe-fixtures';
import { Session } from '../../core/session/session';
import { NotForUseBanner } from './not-for-use-banner';

@Component({
  imports: [NotForUseBanner],
  template: '<kb-not-for-use-banner [version]="version()" [versions]="versions()" />',
})
class Host {
  readonly version = signal<RecipeVersionDto>(aRecipeVersion());
  readonly versions = signal<RecipeVersionDto[]>([]);
}

/** An operator who reaches an old version (a specimen trace, an old link) is told at once it is not for use, and where the current one is. */
describe('NotForUseBanner', () => {
  const v1 = aRecipeVersion({ version: 1, status: 'superseded' });
  const v2 = aRecipeVersion({ version: 2, status: 'withdrawn' });
  const v3 = aRecipeVersion({ version: 3, status: 'approved' });

  async function show(version: RecipeVersionDto, versions: RecipeVersionDto[], roles: Role[] = ['operator']): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), { provide: Session, useValue: { roles: signal(roles) } }],
    });
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.version.set(version);
    fixture.componentInstance.versions.set(versions);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  const banner = (root: HTMLElement) => root.querySelector('[data-testid="not-for-use"]');
  const words = (el: Element | null) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  it('tells an operator a superseded version is not for use and links to the current one', async () => {
    const root = await show(v1, [v3, v2, v1]);
    expect(words(banner(root))).toContain('Not for use — the current version is version 3.');
    expect(words(banner(root))).toContain('Version 1 of KB-0003 is superseded.');
    expect(banner(root)!.querySelector('a')!.getAttribute('href')).toBe('/recipes/3?v=3');
  });

  it('does the same for a withdrawn version', async () => {
    const root = await show(v2, [v3, v2, v1]);
    expect(words(banner(root))).toContain('Version 2 of KB-0003 is withdrawn.');
    expect(banner(root)!.querySelector('a')!.getAttribute('href')).toBe('/recipes/3?v=3');
  });

  it('says so when no version is in use, without a link', async () => {
    const root = await show(v2, [v2, v1]);
    expect(words(banner(root))).toContain('Not for use — KB-0003 has no version in use.');
    expect(banner(root)!.querySelector('a')).toBeNull();
  });

  it('leaves a version coming into force later aside: only the one in force is current', async () => {
    const later = aRecipeVersion({ version: 4, status: 'approved', workflow: { effectiveFrom: '2999-01-01' } as VersionWorkflowDto });
    const root = await show(v1, [later, v3, v1]);
    expect(banner(root)!.querySelector('a')!.getAttribute('href')).toBe('/recipes/3?v=3');
  });

  it('shows nothing on the current version, nor to someone who is not an operator', async () => {
    expect(banner(await show(v3, [v3, v1]))).toBeNull();
    TestBed.resetTestingModule();
    expect(banner(await show(v1, [v3, v1], ['author', 'auditor']))).toBeNull();
  });
});
