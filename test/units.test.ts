import { describe, expect, it } from 'vitest';
import { convertStressFromMPa, PA_PER_PSI, parseStressMPa, parseTemperatureK, parseTimeS, SECONDS_PER_YEAR } from '../src/base/units.js';
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
