import { loadConfig } from '../../server/config';

const production = {
  NODE_ENV: 'production',
  SESSION_SECRET: 'x'.repeat(40),
  STRIPE_WEBHOOK_SECRET: 'whsec_real_one',
  TEAM_NAME: 'Nozzle & Nylon',
  CLUB_NAME: 'Skywhomp Rocketry Club',
  DATA_DIR: '/tmp/padside-config-test',
};

describe('loadConfig in production', () => {
  it('takes the team and club names from the environment', () => {
    expect(loadConfig(production).site).toEqual({ teamName: 'Nozzle & Nylon', clubName: 'Skywhomp Rocketry Club' });
  });

  // A real team never ships under the demo scenario's names.
  it.each([['TEAM_NAME'], ['CLUB_NAME']])('refuses to start without %s', (name) => {
    expect(() => loadConfig({ ...production, [name]: undefined })).toThrow(
      'TEAM_NAME and CLUB_NAME are required in production',
    );
  });

  it('refuses to start without a session secret', () => {
    expect(() => loadConfig({ ...production, SESSION_SECRET: undefined })).toThrow(
      'SESSION_SECRET is required in production',
    );
  });
});
