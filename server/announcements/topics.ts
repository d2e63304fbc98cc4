/** The announcement lists people can ask for. */
export const TOPICS = ['drops', 'launches', 'build-logs'] as const;
export type Topic = (typeof TOPICS)[number];

/** How each list is named in forms and in the mail footer. */
export const TOPIC_LABELS: Record<Topic, string> = {
  drops: 'new runs and drops',
  launches: 'launch days',
  'build-logs': 'new build logs',
};

export const isTopic = (value: string): value is Topic => (TOPICS as readonly string[]).includes(value);
