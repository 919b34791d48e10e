import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Page } from '@shared/api-types';
import type { SpeedMismatch } from '@shared/spindle-speed';
import { aMachine, aWheel } from '../../testing/stock-and-recipe-fixtures';
import { aUser } from '../../testing/user-fixture';
import { errorInterceptor } from '../core/http/error-interceptor';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { StockMachines } from './stock-machines';
import { StockWheels } from './stock-wheels';

/**
 * The Stock lists show, before a wheel is mounted, which machines can turn it above its marked
 * maximum (OSHA 29 CFR 1910.215(d)(1)), the marked maximum in the unit marked on it and the
 * wheel's restriction marks. Worked by hand: 60 000·50/(π·200) = 4774.6 rpm.
 */
const MISMATCH: SpeedMismatch = {
  machineId: 1,
  machineName: 'Precision saw P1',
  wheelId: 2,
  wheelName: 'Diamond blade 200',
  wheelDiameterMm: 200,
  markedIn: 'm/s',
  marked: 50,
  topRpm: 5000,
  limited: false,
  speedAtTopMs: 52.36,
  wheelMaxRpm: 4774,
};

function setUp(): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      { provide: Session, useValue: { user: signal(aUser({ roles: ['author'] })), roles: signal(['author']), clear: vi.fn() } },
      { provide: Notifier, useValue: { show: vi.fn() } },
    ],
  });
  return TestBed.inject(HttpTestingController);
}

const page = <T>(items: T[]): Page<T> => ({ items, total: items.length, page: 0, pageSize: 25 });
const text = (el: Element | null) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

describe('Stock lists: speed and marks', () => {
  let backend: HttpTestingController;
  afterEach(() => backend.verify());

  it('wheels: the marking as marked, the machines that can over-speed the wheel, the restriction marks', async () => {
    backend = setUp();
    const fixture = TestBed.createComponent(StockWheels);
    const root: HTMLElement = fixture.nativeElement;
    const blade = aWheel({
      id: 2,
      name: 'Diamond blade 200',
      kind: 'rim',
      diameterMm: 200,
      maxSpeedMs: 50,
      maxSpeedRpm: 4774.65,
      restrictions: ['wet-use-only'],
    });
    const cbn = aWheel({ id: 3, name: 'CBN 150', kind: 'rim', diameterMm: 150, maxSpeedMarkedIn: 'rpm', maxSpeedRpm: 6000, maxSpeedMs: 47.12 });
    (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/wheels'))).flush(page([blade, cbn]));
    backend.expectOne('/api/stock/speed-mismatches').flush([MISMATCH]);
    await fixture.whenStable();

    const rows = [...root.querySelectorAll('tr.mat-mdc-row')];
    expect(rows).toHaveLength(2);
    expect(text(rows[0]!.querySelector('[data-testid="marked-maximum"]'))).toBe('50 m/s (marked) · 4774 rpm at 200 mm');
    expect(text(rows[1]!.querySelector('[data-testid="marked-maximum"]'))).toBe('6000 rpm (marked) · 47.1 m/s at 150 mm');
    const warning = text(rows[0]!.querySelector('[data-testid="overspeed"]'));
    expect(warning).toContain('Precision saw P1 can turn it to 5000 rpm');
    expect(warning).toContain('4774 rpm at 200 mm');
    expect(rows[1]!.querySelector('[data-testid="overspeed"]')).toBeNull();
    expect(text(rows[0]!.querySelector('[data-testid="restrictions"]'))).toBe('For wet use only');
    expect(text(rows[1]!.querySelector('[data-testid="restrictions"]'))).toBe('None marked');
  });

  it('machines: the spindle limit and who set it, and the wheels the machine can over-speed', async () => {
    backend = setUp();
    const fixture = TestBed.createComponent(StockMachines);
    const root: HTMLElement = fixture.nativeElement;
    const saw = aMachine({ id: 1, name: 'Precision saw P1', rpmMin: 50, rpmMax: 5000 });
    const limited = aMachine({ id: 4, name: 'Bench saw B4', spindleLimitRpm: 3000, spindleLimitSetBy: 'Maintenance, work order 2291' });
    (await vi.waitFor(() => backend.expectOne((r) => r.url === '/api/machines'))).flush(page([saw, limited]));
    backend.expectOne('/api/stock/speed-mismatches').flush([MISMATCH]);
    await fixture.whenStable();

    const rows = [...root.querySelectorAll('tr.mat-mdc-row')];
    expect(text(rows[0]!.querySelector('[data-testid="overspeed"]'))).toContain(
      'Can turn Diamond blade 200 to 5000 rpm, above its marking (4774 rpm at 200 mm)',
    );
    expect(rows[0]!.querySelector('[data-testid="spindle-limit"]')).toBeNull();
    expect(text(rows[1]!.querySelector('[data-testid="spindle-limit"]'))).toBe('limited to 3000 rpm, set by Maintenance, work order 2291');
    expect(rows[1]!.querySelector('[data-testid="overspeed"]')).toBeNull();
  });
});
