// API tests hash passwords and talk to PostgreSQL, MailDev and the payment fake; browser tests drive Chromium.
jest.setTimeout(60_000);
