/**
 * The demo scenario. INVENTED for the demo: a made-up product and duty, not measured data.
 * A snap latch holds the service cover of a rooftop string-inverter housing closed against its gasket.
 */
export const DEMO_SCENARIO = {
  title: 'Rooftop inverter cover latch (invented demo scenario)',
  story:
    'A snap latch keeps the service cover of a rooftop string-inverter housing pressed on its gasket. In summer the housing sits at 70 degC for 8 h a day and 30 degC for the other 16 h; the latch must keep a modulus of at least 800 MPa for 10 years of such days. A 30 % glass-fibre PBT joins the unfilled candidates, with the latch arm moulded along the flow. All numbers here are invented for the demo.',
  candidates: ['PC', 'PBT', 'PBT-GF30', 'PA66-cond', 'POM', 'PPS', 'PP'],
  temperaturesC: [23, 40, 55, 70, 85],
  serviceTime: '10 years',
  requiredModulusMPa: 800,
  /** One day of the duty cycle: [temperature degC, hours]. */
  cycle: [
    [70, 8],
    [30, 16],
  ] as const,
  cycles: 3650,
  /** Retained stress check: the latch is held deflected at this strain (fraction). */
  heldStrain: 0.01,
} as const;
