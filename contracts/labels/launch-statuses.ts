/** A launch day's state (the `launches.status` codes). */
export type LaunchStatus = 'scheduled' | 'called_off' | 'done';

export const LAUNCH_STATUS_LABELS: Readonly<Record<LaunchStatus, string>> = {
  scheduled: 'On the calendar',
  called_off: 'Called off',
  done: 'Flown and closed',
};

/** A flight card's state (the `flights.status` codes). */
export type FlightStatus = 'filed' | 'approved' | 'sent_back' | 'flown';

export const FLIGHT_STATUS_LABELS: Readonly<Record<FlightStatus, string>> = {
  filed: 'Waiting at the table',
  approved: 'Cleared to fly',
  sent_back: 'Sent back',
  flown: 'Flown',
};

/** How a flight ended (the `flights.outcome` codes), in the order the range officer picks from. */
export const FLIGHT_OUTCOMES = ['recovered', 'damaged', 'lost', 'tree', 'motor_failure'] as const;
export type FlightOutcome = (typeof FLIGHT_OUTCOMES)[number];

export const FLIGHT_OUTCOME_LABELS: Readonly<Record<FlightOutcome, string>> = {
  recovered: 'Recovered',
  damaged: 'Recovered with damage',
  lost: 'Lost',
  tree: 'Caught in a tree',
  motor_failure: 'Motor failure',
};

/** How a rocket comes down (the `flights.recovery` codes). */
export const RECOVERY_METHODS = ['parachute', 'streamer', 'dual_deploy'] as const;
export type RecoveryMethod = (typeof RECOVERY_METHODS)[number];

export const RECOVERY_LABELS: Readonly<Record<RecoveryMethod, string>> = {
  parachute: 'Parachute',
  streamer: 'Streamer',
  dual_deploy: 'Dual deployment',
};
