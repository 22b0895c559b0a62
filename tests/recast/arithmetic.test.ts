import { describe, expect, it } from 'vitest';
import { FormulaError, parseFormula } from '../../src/recast/scan/arithmetic.js';

const value = (text: string, p: Record<string, number> = {}) => parseFormula(text, Object.keys(p)).evaluate(p);

describe('derived-parameter formulas', () => {
  it('mass / ratio gives 600 for mass 300 and ratio 0.5', () => {
    expect(value('mass / ratio', { mass: 300, ratio: 0.5 })).toBe(600);
  });
  it('follows the usual precedence: * before +, ^ before unary minus, right-associative ^', () => {
    expect(value('2 + 3 * 4')).toBe(14);
    expect(value('(2 + 3) * 4')).toBe(20);
    expect(value('-2^2')).toBe(-4);
    expect(value('2^3^2')).toBe(512);
    expect(value('10 - 4 - 3')).toBe(3);
    expect(value('8 / 4 / 2')).toBe(1);
    expect(value('1.5e2 + .5')).toBe(150.5);
  });
  it('knows sqrt, exp, log, abs, min and max', () => {
    expect(value('sqrt(16) + abs(-2) + min(3, 4) + max(3, 4) + log(exp(1))')).toBe(14);
  });
  it('lists the parameter names it reads', () => {
    expect(parseFormula('a * b + a', ['a', 'b', 'c']).names).toEqual(['a', 'b']);
  });
  it('reports errors with the column of the offending token', () => {
    const errorOf = (text: string, names: string[] = ['mass']) => {
      try {
        parseFormula(text, names);
      } catch (error) {
        return error as FormulaError;
      }
      throw new Error('expected an error');
    };
    expect(errorOf('mass / ratoi').message).toBe('unknown parameter "ratoi"; known parameters: mass at column 8 of the formula');
    expect(errorOf('mass *').offset).toBe(6);
    expect(errorOf('(mass').message).toMatch(/expected '\)'/);
    expect(errorOf('mass $ 2').message).toMatch(/unexpected character '\$' at column 6/);
    expect(errorOf('sqrt(1, 2)').message).toMatch(/takes 1 argument/);
    expect(errorOf('mass mass').message).toMatch(/unexpected 'mass' at column 6/);
  });
});
