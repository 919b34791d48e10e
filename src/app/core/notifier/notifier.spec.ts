import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Notifier } from './notifier';

describe('Notifier', () => {
  it('opens a snack bar with the message, action and duration', async () => {
    const open = vi.fn();
    TestBed.configureTestingModule({ providers: [{ provide: MatSnackBar, useValue: { open } }] });
    await TestBed.inject(Notifier).show('Saved.', 'OK', 3000);
    expect(open).toHaveBeenCalledWith('Saved.', 'OK', { duration: 3000 });
  });
});
