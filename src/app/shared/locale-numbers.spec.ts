import { formatFigure, parseFigure } from './locale-numbers';

describe('figures in the user locale', () => {
  it('shows a decimal comma where the locale writes one, and a point where it does not', () => {
    expect(formatFigure(1234.56, '1.1-1', 'de-DE')).toBe('1.234,6');
    expect(formatFigure(1234.56, '1.1-1', 'en-US')).toBe('1,234.6');
    expect(formatFigure(0.5, '1.2-2', 'fr-FR')).toBe('0,50');
    expect(formatFigure(null, '1.0-1', 'en-US')).toBe('–');
  });

  it('reads a point or a comma as the decimal mark in any locale', () => {
    for (const locale of ['en-US', 'de-DE', 'fr-FR']) {
      expect(parseFigure('14.5', locale)).toBe(14.5);
      expect(parseFigure('14,5', locale)).toBe(14.5);
      expect(parseFigure(' -0,25 ', locale)).toBe(-0.25);
      expect(parseFigure('', locale)).toBeNull();
    }
  });

  it("reads thousands grouped the locale's way, and both marks as grouping then decimal", () => {
    expect(parseFigure('1,500', 'en-US')).toBe(1500);
    expect(parseFigure('1.500', 'de-DE')).toBe(1500);
    // not the locale's grouping character: the decimal mark
    expect(parseFigure('1,500', 'de-DE')).toBe(1.5);
    expect(parseFigure('12.345,6', 'de-DE')).toBe(12345.6);
    expect(parseFigure('12,345.6', 'de-DE')).toBe(12345.6);
  });

  it('gives NaN for text that is no number', () => {
    expect(parseFigure('abc', 'en-US')).toBeNaN();
    expect(parseFigure('1.2.3', 'de-DE')).toBeNaN();
    expect(parseFigure('12 ft', 'en-US')).toBeNaN();
  });
});
