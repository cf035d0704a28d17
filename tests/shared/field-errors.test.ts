// The client's reading of the server's 400 details and of typed frequencies:
// messages land at fields, paths read as labels, numbers out of range say so.
import { describe, expect, it } from 'vitest';
import { ApiError } from '../../src/lib/api-client';
import { errorInWords, formErrors, messageAtField, pathLabel } from '../../src/lib/field-errors';
import { parseFrequencies, unreadable } from '../../src/features/techniques/components/form/frequency-input';
import { TechniqueSchema } from '../../shared/schemas/technique';

const invalid = (details: { path: string; message: string }[]) => new ApiError(400, 'invalid_input', 'Some body fields are not valid', details);

describe('field errors from the server', () => {
  it('puts a past due date at the due-date field and never says only "Some body fields are not valid"', () => {
    const error = invalid([{ path: 'dueDate', message: 'the due date must not be in the past' }]);
    const errors = formErrors(error, { dueDate: 'Due date', ownerId: 'Owner' });
    expect(errors.at('dueDate')).toBe('the due date must not be in the past');
    expect(errors.unplaced).toEqual([]);
    expect(errorInWords(error, { dueDate: 'Due date' })).toBe('Due date: the due date must not be in the past');
    expect(errorInWords(error)).not.toContain('Some body fields');
  });

  it('says a path as labels, counting list positions from 1, and never shows "(row)" or a raw key', () => {
    expect(pathLabel('calibrationDueOn', { calibrationDueOn: 'Calibration due' })).toBe('Calibration due');
    expect(pathLabel('coils[0].frequenciesHz[0]')).toBe('Coil 1, frequency 1');
    expect(pathLabel('coils.1.diameterMm', { coils: 'Coils', diameterMm: 'diameter' })).toBe('Coil 2, diameter');
    expect(errorInWords(invalid([{ path: '(row)', message: 'this row repeats row 4' }]))).toBe('This row repeats row 4');
    const schemaMessage = { path: 'coils[0].frequenciesHz[0]', message: 'frequenciesHz (test frequency) must be greater than 0 Hz' };
    expect(errorInWords(invalid([schemaMessage]))).toBe('Test frequency must be greater than 0 Hz');
    expect(messageAtField(schemaMessage.message)).toBe('must be greater than 0 Hz');
  });

  it('lists messages of paths the form does not show with their labels', () => {
    const errors = formErrors(invalid([{ path: 'areaId', message: 'no such area' }, { path: 'techniques.0.techniqueId', message: 'a draft' }]), {
      areaId: 'Audited area',
    });
    expect(errors.at('areaId')).toBe('no such area');
    expect(errors.unplaced).toEqual(['Technique 1, technique: a draft']);
  });
});

describe('frequencies typed in the technique editor', () => {
  const messagesFor = (text: string) => {
    const result = TechniqueSchema.safeParse({ coils: [{ frequenciesHz: parseFrequencies(text) }] });
    return result.success ? [] : result.error.issues.filter((issue) => issue.path.join('.').startsWith('coils.0.frequenciesHz')).map((issue) => messageAtField(issue.message));
  };

  it('reads signs, exponents and every unit a person may type', () => {
    expect(parseFrequencies('40 kHz, 160k')).toEqual([40e3, 160e3]);
    expect(parseFrequencies('-500 Hz')).toEqual([-500]);
    expect(parseFrequencies('1e12 Hz')).toEqual([1e12]);
    expect(parseFrequencies('1 THz')).toEqual([1e12]);
  });

  it('says "greater than 0 Hz" for −500 Hz and "at most 100 MHz" for 1e12 Hz and 1 THz', () => {
    expect(messagesFor('-500 Hz')).toEqual(['must be greater than 0 Hz']);
    expect(messagesFor('1e12 Hz')).toEqual(['must be at most 100 MHz']);
    expect(messagesFor('1 THz')).toEqual(['must be at most 100 MHz']);
    expect(unreadable('1 THz')).toBeUndefined();
  });

  it('asks for a number in Hz when the text is not a frequency', () => {
    expect(unreadable('forty kHz')).toBe('“forty kHz” is not a frequency: enter a number in Hz, kHz or MHz (e.g. 40 kHz)');
    expect(unreadable('40 parsecs')).toMatch(/enter a number in Hz/);
  });
});
