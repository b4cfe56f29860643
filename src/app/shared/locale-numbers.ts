import { Directive, ElementRef, Pipe, forwardRef, inject, type OnInit, type PipeTransform } from '@angular/core';
import {
  NG_VALIDATORS,
  NG_VALUE_ACCESSOR,
  type AbstractControl,
  type ControlValueAccessor,
  type ValidationErrors,
  type Validator,
} from '@angular/forms';

/*
 * Numbers in the user's own way of writing them: shown with the browser's locale (a decimal comma
 * in German or French, a point in English) by the platform's Intl, which needs no locale data in the
 * bundle; typed with either separator. Units stay beside every figure, in the templates.
 */

/** The locale figures are shown in: the browser's first language. */
export function displayLocale(): string {
  return (typeof navigator !== 'undefined' && (navigator.languages?.[0] ?? navigator.language)) || 'en';
}

/** The decimal and grouping characters of `locale`, as Intl writes 12345.6. */
function separatorsOf(locale: string): { decimal: string; group: string } {
  const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
  return {
    decimal: parts.find((part) => part.type === 'decimal')?.value ?? '.',
    group: parts.find((part) => part.type === 'group')?.value ?? ',',
  };
}

/**
 * A figure in `locale`, with Angular's digits notation `minInteger.minFraction-maxFraction`
 * (as the `number` pipe takes it), or a dash for none.
 * @example formatFigure(1234.5, '1.1-1', 'de-DE') // => '1.234,5'
 */
export function formatFigure(
  value: number | null | undefined,
  digits = '1.0-3',
  locale = displayLocale(),
  grouping = true,
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  const [, minInteger = '1', minFraction = '0', maxFraction = '3'] = /^(\d+)\.(\d+)-(\d+)$/.exec(digits) ?? [];
  return new Intl.NumberFormat(locale, {
    minimumIntegerDigits: Number(minInteger),
    minimumFractionDigits: Number(minFraction),
    maximumFractionDigits: Math.max(Number(minFraction), Number(maxFraction)),
    useGrouping: grouping,
  }).format(value);
}

/**
 * A typed number, with a decimal point or a decimal comma whatever the locale: where both appear
 * the last is the decimal mark and the others group thousands; one kind alone is the decimal mark
 * unless it is the locale's grouping character between groups of three digits ("1,500" in English).
 * @returns the number, null for an empty text, NaN for text that is no number
 */
export function parseFigure(text: string, locale = displayLocale()): number | null {
  const typed = text.trim().replace(/[\s\u00a0\u202f']/g, '');
  if (typed === '') return null;
  const marks = typed.match(/[.,]/g) ?? [];
  let plain = typed;
  if (marks.length > 0) {
    const last = typed.lastIndexOf(marks.at(-1)!);
    const mixed = new Set(marks).size > 1;
    const { group } = separatorsOf(locale);
    const grouped = !mixed && marks[0] === group && /^[-+]?\d{1,3}([.,]\d{3})+$/.test(typed);
    if (grouped) plain = typed.replace(/[.,]/g, '');
    else if (mixed || marks.length === 1)
      plain = `${typed.slice(0, last).replace(/[.,]/g, '')}.${typed.slice(last + 1)}`;
    else return Number.NaN; // "1.2.3" with no other mark
  }
  return /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(plain) ? Number(plain) : Number.NaN;
}

/** `{{ value | figure: '1.0-1' }}`: a figure in the user's locale; the digits as the `number` pipe takes them. */
@Pipe({ name: 'figure' })
export class FigurePipe implements PipeTransform {
  private readonly locale = displayLocale();

  transform(value: number | null | undefined, digits = '1.0-3'): string {
    return formatFigure(value, digits, this.locale);
  }
}

/**
 * Every `<input type="number">` of a form that imports it becomes a decimal text field: it shows its
 * number in the user's locale, takes a point or a comma, gives the form a number (null when empty),
 * and is invalid (`figure`) while its text is no number. Phones still show the number keys.
 */
@Directive({
  // every number field of a form that imports it, so no field is left with the browser's parsing
  // eslint-disable-next-line @angular-eslint/directive-selector
  selector: 'input[type=number][formControlName], input[type=number][formControl], input[type=number][ngModel]',
  host: { '(input)': 'typed()', '(blur)': 'touched()', inputmode: 'decimal' },
  providers: [
    { provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => DecimalInput), multi: true },
    { provide: NG_VALIDATORS, useExisting: forwardRef(() => DecimalInput), multi: true },
  ],
})
export class DecimalInput implements ControlValueAccessor, Validator, OnInit {
  private readonly input = inject<ElementRef<HTMLInputElement>>(ElementRef).nativeElement;
  private readonly locale = displayLocale();
  private changed: (value: number | null) => void = () => undefined;
  private touchedCallback: () => void = () => undefined;
  private unreadable = false;

  constructor() {
    this.asText();
  }

  ngOnInit(): void {
    this.asText();
  }

  /** A number field would drop a comma before the form saw it (and matInput sets the type from its attribute). */
  private asText(): void {
    if (this.input.type !== 'text') this.input.type = 'text';
  }

  writeValue(value: number | null | undefined): void {
    this.asText();
    this.unreadable = false;
    this.input.value =
      value === null || value === undefined || Number.isNaN(value)
        ? ''
        : formatFigure(value, '1.0-10', this.locale, false);
  }

  registerOnChange(callback: (value: number | null) => void): void {
    this.changed = callback;
  }

  registerOnTouched(callback: () => void): void {
    this.touchedCallback = callback;
  }

  setDisabledState(disabled: boolean): void {
    this.input.disabled = disabled;
  }

  validate(_control: AbstractControl): ValidationErrors | null {
    return this.unreadable ? { figure: true } : null;
  }

  protected typed(): void {
    const value = parseFigure(this.input.value, this.locale);
    this.unreadable = Number.isNaN(value);
    this.changed(this.unreadable ? null : value);
  }

  protected touched(): void {
    this.touchedCallback();
  }
}
