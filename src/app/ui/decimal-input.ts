import { Directive, ElementRef, forwardRef, inject } from '@angular/core';
import { type AbstractControl, type ControlValueAccessor, NG_VALIDATORS, NG_VALUE_ACCESSOR, type ValidationErrors, type Validator } from '@angular/forms';
import { formatDecimalText, parseDecimalText } from '@shared/decimal-text';

/** The decimal and thousands signs of the person's browser locale ('.' and ',' in English). */
export function localeSigns(locale = typeof navigator === 'undefined' ? 'en' : (navigator.languages?.[0] ?? navigator.language)): {
  decimal: string;
  group: string;
} {
  try {
    const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
    return { decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.', group: parts.find((p) => p.type === 'group')?.value ?? ',' };
  } catch {
    return { decimal: '.', group: ',' };
  }
}

/**
 * Every number field of the app: `<input matInput kbDecimal formControlName="…">`. A text
 * field rather than type="number", whose browser parsing depends on the locale and silently
 * drops a decimal sign it reads as a thousands separator ("0,3" became 3). A comma or a
 * point is the decimal sign; anything ambiguous leaves the control null with a `decimal`
 * error that says why (see shared/decimal-text.ts). The control's value is a number or null.
 */
@Directive({
  selector: 'input[kbDecimal]',
  providers: [
    { provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => DecimalInput), multi: true },
    { provide: NG_VALIDATORS, useExisting: forwardRef(() => DecimalInput), multi: true },
  ],
  host: {
    type: 'text',
    inputmode: 'decimal',
    autocomplete: 'off',
    '(input)': 'typed($any($event.target).value)',
    '(blur)': 'onTouched()',
  },
})
export class DecimalInput implements ControlValueAccessor, Validator {
  private readonly element = inject<ElementRef<HTMLInputElement>>(ElementRef).nativeElement;
  private readonly signs = localeSigns();
  /** Why the text in the field is refused, or '' while it reads as a number. */
  private problem = '';
  private onChange: (value: number | null) => void = () => undefined;
  protected onTouched: () => void = () => undefined;

  writeValue(value: unknown): void {
    this.problem = '';
    this.element.value = typeof value === 'number' ? formatDecimalText(value, this.signs.decimal) : '';
  }

  registerOnChange(fn: (value: number | null) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.element.disabled = disabled;
  }

  validate(_control: AbstractControl): ValidationErrors | null {
    return this.problem ? { decimal: this.problem } : null;
  }

  protected typed(text: string): void {
    const result = parseDecimalText(text, this.signs.group);
    this.problem = result.ok ? '' : result.message;
    this.onChange(result.ok ? result.value : null);
  }
}
