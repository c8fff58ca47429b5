/** The pane's calibration form as the tests start it, shared so that each test types only the fields it is about. */
import type { CalibrationFields } from '../../addin/jobs/calibrate/request.js';

/** Nothing typed: PBT to start from, and the creep time and temperature the page shows (addin/taskpane.html: 1000 h, 23 degC). */
export const BLANK_CALIBRATION_FIELDS: CalibrationFields = {
  start: 'PBT',
  modulus23: '',
  hdtA: '',
  hdtB: '',
  tg: '',
  tm: '',
  creepModulus: '',
  creepTime: '1000 h',
  creepTemperature: '23',
  id: '',
};
