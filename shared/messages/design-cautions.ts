/**
 * The cautions shown wherever a design result could be acted on (the design pages' panel, every
 * proposal, what is sent to a client): what could hurt someone when the design is built or wired,
 * and that the figures are estimates. They defer to local codes and licensed practice.
 */
export const DESIGN_CAUTIONS: ReadonlyArray<{ title: string; text: string }> = [
  {
    title: 'Electricity near water.',
    text: 'Ground-fault (GFCI/RCD) protection, pumps and cords listed for wet locations and bonding as the local electrical code requires; a licensed electrician where the code asks for one; lock out the power before anyone touches a pump or reaches into the water.',
  },
  {
    title: 'Suction and drowning.',
    text: 'Intakes people or animals can reach need covers, split drains or vacuum relief against entrapment.',
  },
  {
    title: 'Running the pumps.',
    text: 'No dry running and no running against a closed valve; a check valve on every parallel pump; close valves slowly to spare the pipe from water hammer.',
  },
  {
    title: 'Suction lift and priming.',
    text: "An external pump standing above the water it draws must be self-priming, or be primed and kept full with a foot valve on the suction pipe; a flooded suction (pump below the water) avoids both. Defer to the pump maker's data for the lift and NPSH it needs.",
  },
  {
    title: 'Vaults, wet wells and trenches',
    text: 'are confined spaces and excavations: follow the entry and shoring rules that apply.',
  },
  {
    title: 'Estimates, not guarantees.',
    text: "Every figure here is a design estimate from published curves and textbook formulas: verify it against the pump maker's data, local codes and licensed practice before ordering or building.",
  },
];

/**
 * The caution beside every cable-run answer (its code stays fixed for clients; the sentence may be
 * worded better): the suggestion sizes for voltage drop alone, and the people and code who decide.
 */
export const CABLE_RUN_CAUTION = {
  code: 'cable-run-electrician-decides',
  title: 'Electricity near water: the cable run.',
  text: 'This conductor is sized for voltage drop alone (copper at 75 C, resistance only); ampacity, overcurrent protection, the motor-circuit rules and derating for burial or heat also decide it. The circuit needs ground-fault (GFCI/RCD) protection, cable and equipment listed for wet or buried locations and bonding as the local electrical code requires: a licensed electrician and the local code decide the cable.',
} as const;
