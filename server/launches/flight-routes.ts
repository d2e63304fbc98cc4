import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../platform/app-error';
import { requireSignedIn } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { ColumnMapping } from '../../contracts/flights/column-mapping';
import { columnMappingSchema } from '../../contracts/flights/column-mapping-schema';
import type { FlightService } from './flight-service';
import { RANGE_STAFF } from './launch-routes';
import { DecisionSchema, OutcomeSchema } from '../../contracts/launches/launch-schemas';

/** Enough for 200,000 rows of a wide log (timestamps, pressure, temperature, three axes). */
export const MAX_LOG_BYTES = 32 * 1024 * 1024;

/** multer with a byte limit; its errors become our 4xx, named on the `log` field. */
const logFile: RequestHandler = (req, res, next) => {
  multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_LOG_BYTES, files: 1, fields: 4, fieldSize: 64 * 1024 },
  }).single('log')(req, res, (err: unknown) => {
    if (err instanceof multer.MulterError) {
      return next(
        err.code === 'LIMIT_FILE_SIZE'
          ? new AppError(413, 'file_too_large', `A log can be at most ${MAX_LOG_BYTES / 1024 / 1024} MB.`, {
              log: 'Too large.',
            })
          : new AppError(400, 'bad_upload', err.message, { log: err.message }),
      );
    }
    next(err);
  });
};

/** The optional `columns` field: JSON naming which column is which, in which unit. */
function columnsField(value: unknown): ColumnMapping | undefined {
  if (value === undefined || value === '') return undefined;
  let json: unknown;
  try {
    json = JSON.parse(String(value));
  } catch {
    throw new AppError(400, 'unmappable_log', 'The column mapping must be JSON.', { columns: 'Not JSON.' });
  }
  const result = columnMappingSchema.safeParse(json);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  throw new AppError(400, 'unmappable_log', issue.message, { [['columns', ...issue.path].join('.')]: issue.message });
}

/** /api/flights: a flight's page (public, so build logs can embed it) and its altimeter log. */
export function flightRoutes(flights: FlightService): Router {
  const r = Router();
  r.get('/:id', async function showFlight(req, res) {
    res.json(await flights.show(parse(fields.id, req.params.id)));
  });
  r.post('/:id/data', requireSignedIn, logFile, async function uploadFlightLog(req, res) {
    const id = parse(fields.id, req.params.id);
    if (!req.file) throw badRequest('Choose an altimeter log (CSV) to upload.', { log: 'Required.' });
    res.status(201).json(
      await flights.uploadLog(id, req.user!, {
        bytes: req.file.buffer,
        fileName: req.file.originalname,
        columns: columnsField(req.body?.columns),
      }),
    );
  });
  return r;
}

/** /api/admin/flights (range officer, admin): decisions and outcomes at the range table. */
export function flightAdminRoutes(flights: FlightService): Router {
  const r = Router();
  r.use(RANGE_STAFF);
  r.post('/:id/decision', async function decideFlight(req, res) {
    const body = parse(DecisionSchema, req.body);
    res.json(await flights.decide(parse(fields.id, req.params.id), req.user!.id, body.approve, body.reason ?? null));
  });
  r.post('/:id/outcome', async function flightOutcome(req, res) {
    const body = parse(OutcomeSchema, req.body);
    res.json(await flights.outcome(parse(fields.id, req.params.id), body.outcome, body.notes ?? null));
  });
  return r;
}

/** /api/account/flights: the signed-in member's logbook. */
export function logbookRoutes(flights: FlightService): Router {
  const r = Router();
  r.get('/', requireSignedIn, async function logbook(req, res) {
    res.json(await flights.logbook(req.user!.id));
  });
  return r;
}
