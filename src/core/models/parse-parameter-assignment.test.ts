import { describe, expect, it } from 'vitest';
import { getModel } from './index';
import { parseParameterAssignment } from './parse-parameter-assignment';
import { RingfallError } from '../errors';

const codeOf = (run: () => unknown): string => {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return (error as RingfallError).code;
  }
  return 'no error';
};

describe('parseParameterAssignment()', () => {
  it('parseParameterAssignment() reads NAME=QTY into SI in the parameter\'s own kind', () => {
    // CONTRACT.md quantities: "45mm", "120A", "5 G"; 1 G = 1e-4 T exactly (NIST SP 811 B.9)
    expect(parseParameterAssignment(getModel('loop'), 'radius=45mm', '--set')).toEqual({ index: 1, name: 'radius', value: 0.045 });
    expect(parseParameterAssignment(getModel('loop'), 'ampereTurns = 120 A', '--set').value).toBe(120);
    expect(parseParameterAssignment(getModel('loop'), 'background=5 G', '--fix').value).toBeCloseTo(5e-4, 18);
    expect(parseParameterAssignment(getModel('power-law'), 'exponent=2.5', '--set').value).toBe(2.5);
    expect(parseParameterAssignment(getModel('dipole'), 'moment=0.5 A·m²', '--set').value).toBe(0.5);
  });

  it('parseParameterAssignment() rejects bad input with stable codes', () => {
    // STYLE.md errors: class and code asserted
    const loop = getModel('loop');
    expect(codeOf(() => parseParameterAssignment(loop, 'radius', '--set'))).toBe('PARAMETER_SYNTAX');
    expect(codeOf(() => parseParameterAssignment(loop, 'turns=10', '--set'))).toBe('PARAMETER_UNKNOWN');
    expect(codeOf(() => parseParameterAssignment(loop, 'radius=5mT', '--fix'))).toBe('QUANTITY_KIND');
    expect(codeOf(() => parseParameterAssignment(loop, 'radius=-5mm', '--set'))).toBe('PARAMETER_VALUE');
    expect(codeOf(() => parseParameterAssignment(getModel('power-law'), 'exponent=steep', '--set'))).toBe('PARAMETER_VALUE');
    expect(codeOf(() => parseParameterAssignment(getModel('power-law'), 'exponent=-1', '--set'))).toBe('PARAMETER_VALUE');
  });
});
