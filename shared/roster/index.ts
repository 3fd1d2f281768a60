/** The shift roster's engine: people from rows, and turnovers staffed from them across rooms. */
export * from './expand';
export * from './crew-problem';
export * from './day-key';
export * from './clusters';
export * from './assign-crews';
export * from './staff-gaps';
