import { describe, expect, it } from 'vitest';
import {
  convertStressFromMPa,
  PA_PER_PSI,
  parseStrain,
  parseStressMPa,
  parseTemperatureK,
  parseTimeS,
  SECONDS_PER_YEAR,
} from '../src/base/units.js';
import { expectClose } from './expect.js';

const NIST = 'NIST SP 811 (2008), appendix B.8';

describe('temperature', () => {
  it('takes bare numbers as degC', () => {
    expectClose(parseTemperatureK(80), 353.15, { abs: 1e-12, source: 'SI Brochure 9th ed. 2019: T/K = t/degC + 273.15' });
    expectClose(parseTemperatureK('80'), 353.15, { abs: 1e-12, source: 'SI Brochure 9th ed. 2019' });
  });
  it('converts degF and K text', () => {
    expectClose(parseTemperatureK('176 degF'), 353.15, { abs: 1e-9, source: `${NIST}: t/degC = (t/degF - 32)/1.8` });
    expectClose(parseTemperatureK('350 K'), 350, { abs: 1e-12, source: 'identity' });
    expectClose(parseTemperatureK('80 °C'), 353.15, { abs: 1e-12, source: 'SI Brochure 9th ed. 2019' });
    expectClose(parseTemperatureK(' 80   degc '), 353.15, { abs: 1e-12, source: 'SI Brochure 9th ed. 2019' });
  });
  it('rejects absolute zero and below, wrong units, empty text and non-finite numbers', () => {
    expect(() => parseTemperatureK(-300)).toThrow(/temperature: -300 is at or below absolute zero/);
    expect(() => parseTemperatureK('0 K')).toThrow(/absolute zero/);
    expect(() => parseTemperatureK('5 kg', 'service_temp')).toThrow("service_temp: temperature needs a temperature unit, got '5 kg'");
    expect(() => parseTemperatureK('80 furlongs')).toThrow(/unknown unit 'furlongs'/);
    expect(() => parseTemperatureK('')).toThrow(/temperature: a temperature is required/);
    expect(() => parseTemperatureK(NaN)).toThrow(/finite/);
    expect(() => parseTemperatureK(Infinity)).toThrow(/finite/);
    expect(() => parseTemperatureK('hot')).toThrow(/expected a number/);
  });
});

describe('time', () => {
  it('takes bare numbers as hours and converts units', () => {
    expect(parseTimeS(1000)).toBe(3.6e6);
    expect(parseTimeS('1000 h')).toBe(3.6e6);
    expect(parseTimeS('10 s')).toBe(10);
    expect(parseTimeS('2 min')).toBe(120);
    expect(parseTimeS('3 d')).toBe(259200);
    expect(parseTimeS('1 week')).toBe(604800);
    expectClose(parseTimeS('5 y'), 5 * 365.25 * 86400, { rel: 1e-15, source: 'IAU Julian year, 365.25 d' });
    expectClose(parseTimeS('5 years'), 5 * SECONDS_PER_YEAR, { rel: 1e-15, source: 'IAU Julian year, 365.25 d' });
  });
  it('rejects zero, negative, wrong unit and junk', () => {
    expect(() => parseTimeS(0)).toThrow(/time: a time must be greater than zero/);
    expect(() => parseTimeS('-5 h')).toThrow(/greater than zero/);
    expect(() => parseTimeS('5 kg')).toThrow("time: time needs a time unit, got '5 kg'");
    expect(() => parseTimeS('5 m')).toThrow(/time needs a time unit/);
  });
});

describe('stress', () => {
  it('converts psi and ksi with the NIST factor', () => {
    expect(PA_PER_PSI).toBe(6894.757293168);
    expectClose(parseStressMPa('1 psi'), 6894.757e-6, { rel: 1e-6, source: `${NIST}: 1 psi = 6894.757 Pa` });
    expectClose(parseStressMPa('300 ksi'), 2068.4271879504, { rel: 1e-12, source: `${NIST}: 1 ksi = 1000 psi` });
    expectClose(parseStressMPa('2.4 GPa'), 2400, { rel: 1e-12, source: 'SI prefixes' });
    expectClose(parseStressMPa('2400'), 2400, { rel: 0, source: 'bare numbers are MPa (DESIGN.md)' });
    expectClose(convertStressFromMPa(6.894757293168, 'ksi'), 1, { rel: 1e-12, source: NIST });
  });
  it('rejects non-stress units and non-positive values', () => {
    expect(() => parseStressMPa('5 kg', 'required_modulus')).toThrow("required_modulus: stress needs a stress unit, got '5 kg'");
    expect(() => parseStressMPa(0)).toThrow(/greater than zero/);
    expect(() => convertStressFromMPa(1, 'h')).toThrow(/needs a stress unit/);
  });
});

describe('unit text: SI prefixes keep their case, only decimal numbers are numbers', () => {
  const SI = 'SI Brochure 9th ed. 2019, 3.1: prefix symbols are case-sensitive (M mega 1e6, m milli 1e-3)';
  it('reads Ms as a megasecond and ms as a millisecond; mPa as a millipascal and MPa as a megapascal', () => {
    expectClose(parseTimeS('1 Ms'), 1e6, { rel: 1e-15, source: SI });
    expectClose(parseTimeS('1 ms'), 1e-3, { rel: 1e-15, source: SI });
    expectClose(parseStressMPa('800 mPa'), 8e-7, { rel: 1e-12, source: SI });
    expectClose(parseStressMPa('800 MPa'), 800, { rel: 0, source: SI });
  });
  it('refuses a case-folded prefix rather than guessing mega or milli', () => {
    for (const text of ['800 mpa', '800 MPA', '800 Mpa']) {
      expect(() => parseStressMPa(text, 'required_modulus')).toThrow(
        /^required_modulus: .* is ambiguous: unit prefixes are case-sensitive; write 'MPa'/,
      );
    }
    expect(() => parseTimeS('1 MS', 'time')).toThrow(/^time: 'MS' in '1 MS' is ambiguous.*'Ms' \(megasecond\)/);
  });
  it('still reads unit words and prefix-free symbols in any case', () => {
    const same = 'common practice: unit words have one meaning in any case';
    expectClose(parseTemperatureK('80 Celsius'), 353.15, { abs: 1e-12, source: same });
    expectClose(parseTemperatureK('80 celsius'), 353.15, { abs: 1e-12, source: same });
    expectClose(parseTemperatureK('80 DEGC'), 353.15, { abs: 1e-12, source: same });
    expectClose(parseTemperatureK('176 Fahrenheit'), 353.15, { abs: 1e-9, source: `${NIST}: t/degC = (t/degF - 32)/1.8` });
    expect(parseTimeS('5 Hours')).toBe(18000);
    expect(parseTimeS('3 MIN')).toBe(180);
    expectClose(parseStressMPa('2 GPA'), 2000, { rel: 1e-12, source: SI });
    expectClose(parseStressMPa('5 kpa'), 0.005, { rel: 1e-12, source: SI });
  });
  it('refuses hexadecimal, binary and octal text and decimal commas; only decimal numbers are numbers', () => {
    for (const text of ['0x50', '0b101', '0o17', '-0x10', '0x50 h']) {
      expect(() => parseTemperatureK(text, 'temperature')).toThrow(/is not a decimal number/);
      expect(() => parseTimeS(text, 'time')).toThrow(/is not a decimal number/);
      expect(() => parseStressMPa(text, 'modulus')).toThrow(/is not a decimal number/);
    }
    expect(() => parseStrain('0x10')).toThrow(/^strain: '0x10' is not a decimal number/);
    expect(() => parseTimeS('1,5 h')).toThrow(/a comma in a number is ambiguous/);
    expect(parseTemperatureK('1.5e1')).toBe(15 + 273.15);
  });
  it('says a number beyond the double range is out of range, not that it lacks a unit', () => {
    expect(() => parseTemperatureK('1e400', 'temperature')).toThrow("temperature: '1e400' is out of range for a number (beyond 1.8e308)");
    expect(() => parseTimeS('1e400 h')).toThrow(/1e400 in '1e400 h' is out of range for a number/);
  });
  it('names the quantity a unit measures when it is the wrong one', () => {
    expect(() => parseStressMPa('800 degC', 'required_modulus')).toThrow(
      /^required_modulus: '800 degC' is a temperature, but a stress or modulus is needed here/,
    );
    expect(() => parseTemperatureK('10 h', 'temperature')).toThrow(/^temperature: '10 h' is a time, but a temperature is needed here/);
    expect(() => parseTimeS('2 GPa', 'time')).toThrow(/^time: '2 GPa' is a stress or modulus, but a time is needed here/);
  });
});
