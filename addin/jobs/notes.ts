/** Text the pane shows and writes beside its results. */

export const CAUTION =
  'Estimates for screening and comparison only. Real grades differ with filler, fibre orientation, moisture, ageing, chemicals, processing and stress level (the model is linear viscoelastic, small strain). Confirm with the supplier data and with creep or relaxation tests (ISO 899, ASTM D2990); apply the safety factors of the applicable code; for parts whose failure can hurt someone, defer to local codes and licensed engineering review.';

export const MODEL_NOTE =
  'E_r is the relaxation modulus of the Resin Derate model: glassy, glass-transition, rubbery and flow regions (crystal plateau and melting for semi-crystalline families), shifted in time by WLF above Tg and Arrhenius below.';

export const FAMILY_NOTE =
  'Family symbols stand for typical unfilled, general-purpose grades of the bundled table (=DERATE.FAMILIES() lists them; the pane shows the source of each number).';

export const CALIBRATION_NOTE =
  "A calibrated block reproduces the datasheet numbers it was given (the check above), not the grade's behaviour at other times, temperatures or stresses, where the model extrapolates with the starting family's other parameters. Use it for screening only.";

export const FILLED_NOTE =
  'Filled grades ("PBT-GF30", "PA66-GF30 at 50 % RH") are estimated from the unfilled family by Halpin-Tsai, along the flow direction as datasheets give it: across flow, at weld lines and where fibres lie at random the modulus is lower.';
