import { z } from 'zod';
import { FUEL_GRADES } from './vessels';

// ---------------------------------------------------------------------------------------------------------------
// CSV intake: columns, units, mapping

/** What a CSV column can hold. 'ignore' drops the column. */
export const LOG_FIELDS = [
  'date',
  'genset',
  'runningHoursMeter',
  'hoursRun',
  'kwhMeter',
  'kwh',
  'fuelMass',
  'fuelVolume',
  'fuelTemp',
  'fuelLot',
  'remarks',
  'seaH',
  'manoeuvringH',
  'portH',
  'anchorageH',
  'shorePowerH',
  'ignore',
] as const;
export const logFieldSchema = z.enum(LOG_FIELDS);
export type LogField = z.infer<typeof logFieldSchema>;

/** Operating-mode columns (per vessel and day, not per set). */
export const MODE_FIELDS = ['seaH', 'manoeuvringH', 'portH', 'anchorageH', 'shorePowerH'] as const;
export type ModeField = (typeof MODE_FIELDS)[number];

/** Units a column may be in, by field; the first is the unit stored. */
export const FIELD_UNITS = {
  runningHoursMeter: ['h'],
  hoursRun: ['h'],
  kwhMeter: ['kWh', 'MWh'],
  kwh: ['kWh', 'MWh'],
  fuelMass: ['kg', 't'],
  fuelVolume: ['L', 'm3'],
  fuelTemp: ['C'],
  seaH: ['h'],
  manoeuvringH: ['h'],
  portH: ['h'],
  anchorageH: ['h'],
  shorePowerH: ['h'],
} as const satisfies Partial<Record<LogField, readonly string[]>>;
export const UNITS = ['h', 'kWh', 'MWh', 'kg', 't', 'L', 'm3', 'C'] as const;
export const unitSchema = z.enum(UNITS);
export type Unit = z.infer<typeof unitSchema>;

export const FIELD_LABELS: Record<LogField, string> = {
  date: 'Date',
  genset: 'Genset',
  runningHoursMeter: 'Running-hour meter',
  hoursRun: 'Hours run',
  kwhMeter: 'Energy meter',
  kwh: 'Energy produced',
  fuelMass: 'Fuel mass',
  fuelVolume: 'Fuel volume',
  fuelTemp: 'Fuel temperature',
  fuelLot: 'Fuel lot reference',
  remarks: 'Remarks',
  seaH: 'Sea passage hours',
  manoeuvringH: 'Manoeuvring hours',
  portH: 'Port hours',
  anchorageH: 'Anchorage hours',
  shorePowerH: 'Shore power hours',
  ignore: 'Ignore',
};

/**
 * Date formats. Slash dates are ambiguous between day-first and month-first when no day number exceeds 12; the
 * user must then choose.
 */
export const DATE_FORMATS = ['yyyy-mm-dd', 'dd/mm/yyyy', 'mm/dd/yyyy', 'dd.mm.yyyy'] as const;
export const dateFormatSchema = z.enum(DATE_FORMATS);
export type DateFormat = z.infer<typeof dateFormatSchema>;

export const columnMappingEntrySchema = z
  .object({
    field: logFieldSchema,
    unit: unitSchema.optional(),
    /** For wide files (one row per day, columns per set): the set's designation this column belongs to. */
    genset: z.string().trim().min(1).max(20).optional(),
  })
  .superRefine((c, ctx) => {
    const allowed = (FIELD_UNITS as Record<string, readonly string[]>)[c.field];
    if (allowed && c.unit && !allowed.includes(c.unit)) {
      ctx.addIssue({ code: 'custom', path: ['unit'], message: `${FIELD_LABELS[c.field]} is in ${allowed.join(' or ')}, not ${c.unit}` });
    }
    if (!allowed && c.unit) ctx.addIssue({ code: 'custom', path: ['unit'], message: `${FIELD_LABELS[c.field]} takes no unit` });
  });
export type ColumnMappingEntry = z.infer<typeof columnMappingEntrySchema>;

export const columnMappingSchema = z.object({
  /** Keyed by the header text exactly as in the file. */
  columns: z.record(z.string(), columnMappingEntrySchema),
  dateFormat: dateFormatSchema.optional(),
  decimalSeparator: z.enum(['.', ',']).optional(),
});
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

/** The non-file parts of a preview request (multipart field `options`, JSON). */
export const previewOptionsSchema = z.object({
  mapping: columnMappingSchema.optional(),
});
export type PreviewOptions = z.infer<typeof previewOptionsSchema>;

/** The non-file parts of a commit request (multipart field `options`, JSON). */
export const commitOptionsSchema = z.object({
  mapping: columnMappingSchema,
  overwriteChanged: z.boolean(),
  fileSha256: z.string().regex(/^[0-9a-f]{64}$/, 'The preview gives the file hash as 64 hex digits'),
  /** Save the mapping for this vessel under this name (default 'default'). */
  saveMappingAs: z.string().trim().min(1).max(60).optional(),
});
export type CommitOptions = z.infer<typeof commitOptionsSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Rows

/** Flag codes: the optimizer's quality flags plus the intake's own fuel-lot notes. */
export const LOG_FLAG_CODES = [
  'HOURS_OVER_24',
  'HOURS_NEGATIVE',
  'METER_NEGATIVE_DELTA',
  'METER_PREVIOUS_MISSING',
  'METER_REPLACEMENT_INCONSISTENT',
  'KWH_OVER_RATED',
  'SFOC_OUT_OF_BAND',
  'LOW_LOAD',
  'FUEL_WITHOUT_HOURS',
  'MISSING_DAY',
  'DUPLICATE_DATE',
  'FUEL_LOT_ASSUMED',
  'FUEL_LOT_MISSING',
  'FUEL_NOT_LOGGED',
] as const;
export const logFlagCodeSchema = z.enum(LOG_FLAG_CODES);
export type LogFlagCode = z.infer<typeof logFlagCodeSchema>;

export const logFlagSchema = z.object({
  code: logFlagCodeSchema,
  field: z.string(),
  severity: z.enum(['error', 'warning']),
  message: z.string(),
});
export type LogFlag = z.infer<typeof logFlagSchema>;

/** Raw values of one genset-day in stored units (h, kWh, kg, L, °C). */
export const rawLogValuesSchema = z.object({
  runningHoursMeter: z.number().nullable(),
  hoursRun: z.number().nullable(),
  kwhMeter: z.number().nullable(),
  kwh: z.number().nullable(),
  fuelMassKg: z.number().nullable(),
  fuelVolumeL: z.number().nullable(),
  fuelTempC: z.number().nullable(),
  fuelLotId: z.uuid().nullable(),
  remarks: z.string().nullable(),
});
export type RawLogValues = z.infer<typeof rawLogValuesSchema>;

export const derivedLogSchema = z.object({
  hoursRun: z.number().nullable(),
  kwh: z.number().nullable(),
  avgLoadKw: z.number().nullable(),
  avgLoadPct: z.number().nullable(),
  fuelKgAt15: z.number().nullable(),
  fuelKgIso: z.number().nullable(),
  lcvKjPerKg: z.number().nullable(),
  lcvBasis: z.string().nullable(),
  sfocObservedGPerKwh: z.number().nullable(),
  sfocIsoGPerKwh: z.number().nullable(),
  co2Kg: z.number().nullable(),
  fuelLotReference: z.string().nullable(),
  usable: z.boolean(),
});
export type DerivedLog = z.infer<typeof derivedLogSchema>;

const optionalNumber = (label: string, min = 0) =>
  z
    .number({ message: `${label} must be a number` })
    .min(min, `${label} cannot be below ${min}`)
    .nullable()
    .default(null);

/** Manual entry or edit of one genset-day, in stored units. */
export const logEntryInputSchema = z
  .object({
    gensetId: z.uuid('Choose a genset'),
    logDate: z.iso.date('Enter the date as YYYY-MM-DD'),
    runningHoursMeter: optionalNumber('Running-hour meter reading'),
    hoursRun: optionalNumber('Hours run'),
    kwhMeter: optionalNumber('Energy meter reading'),
    kwh: optionalNumber('Energy produced'),
    fuelMassKg: optionalNumber('Fuel mass'),
    fuelVolumeL: optionalNumber('Fuel volume'),
    fuelTempC: optionalNumber('Fuel temperature', -18),
    fuelLotId: z.uuid().nullable().default(null),
    remarks: z.string().trim().max(500).nullable().default(null),
  })
  .superRefine((v, ctx) => {
    if (v.runningHoursMeter === null && v.hoursRun === null) {
      ctx.addIssue({ code: 'custom', path: ['hoursRun'], message: 'Enter the running-hour meter reading or the hours run' });
    }
    if (v.kwhMeter === null && v.kwh === null) ctx.addIssue({ code: 'custom', path: ['kwh'], message: 'Enter the energy meter reading or the kWh produced' });
    if (v.fuelMassKg !== null && v.fuelVolumeL !== null) {
      ctx.addIssue({ code: 'custom', path: ['fuelVolumeL'], message: 'Enter the fuel as a mass or as a volume, not both' });
    }
    if (v.fuelVolumeL !== null && v.fuelTempC === null) {
      ctx.addIssue({ code: 'custom', path: ['fuelTempC'], message: 'A fuel volume needs its temperature' });
    }
  });
export type LogEntryInput = z.input<typeof logEntryInputSchema>;

export const exclusionInputSchema = z
  .object({ excluded: z.boolean(), reason: z.string().trim().max(300).nullable().default(null) })
  .refine((v) => !v.excluded || (v.reason !== null && v.reason.length > 0), { path: ['reason'], message: 'Give a reason for excluding the day' });
export type ExclusionInput = z.input<typeof exclusionInputSchema>;

export const LOG_SORT_KEYS = [
  'logDate',
  'genset',
  'hoursRun',
  'kwh',
  'avgLoadKw',
  'avgLoadPct',
  'fuelKgAt15',
  'fuelKgIso',
  'sfocObservedGPerKwh',
  'sfocIsoGPerKwh',
  'co2Kg',
] as const;

export const logListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.enum(LOG_SORT_KEYS).default('logDate'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  gensetId: z.uuid().optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  flag: logFlagCodeSchema.optional(),
});
export type LogListQuery = z.input<typeof logListQuerySchema>;

export const logRowSchema = rawLogValuesSchema.extend({
  id: z.uuid(),
  gensetId: z.uuid(),
  designation: z.string(),
  logDate: z.string(),
  ratedKw: z.number(),
  excludedFromFit: z.boolean(),
  excludeReason: z.string().nullable(),
  source: z.string(),
  importId: z.uuid().nullable(),
  derived: derivedLogSchema,
  flags: z.array(logFlagSchema),
});
export type LogRow = z.infer<typeof logRowSchema>;

export const logListSchema = z.object({
  rows: z.array(logRowSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  missingDays: z.array(z.object({ gensetId: z.uuid(), designation: z.string(), date: z.string() })),
});
export type LogList = z.infer<typeof logListSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Preview, commit, history

export const ROW_STATUSES = ['new', 'changed', 'unchanged', 'error'] as const;
export type RowStatus = (typeof ROW_STATUSES)[number];

export const issueSchema = z.object({ path: z.string(), message: z.string(), row: z.number().optional() });
export type Issue = z.infer<typeof issueSchema>;

export const previewRowSchema = z.object({
  /** Row in the file as a spreadsheet counts it (the header is row 1). */
  row: z.number(),
  gensetId: z.uuid().nullable(),
  designation: z.string().nullable(),
  logDate: z.string().nullable(),
  status: z.enum(ROW_STATUSES),
  values: rawLogValuesSchema.nullable(),
  before: rawLogValuesSchema.nullable(),
  derived: derivedLogSchema.nullable(),
  errors: z.array(issueSchema),
  flags: z.array(logFlagSchema),
});
export type PreviewRow = z.infer<typeof previewRowSchema>;

export const modeHoursValuesSchema = z.object({
  seaH: z.number().min(0).max(25),
  manoeuvringH: z.number().min(0).max(25),
  portH: z.number().min(0).max(25),
  anchorageH: z.number().min(0).max(25),
  shorePowerH: z.number().min(0).max(25),
});

export const previewSchema = z.object({
  fileName: z.string(),
  fileSha256: z.string(),
  delimiter: z.string(),
  decimalSeparator: z.enum(['.', ',']),
  dateFormat: dateFormatSchema.nullable(),
  headers: z.array(z.string()),
  mapping: columnMappingSchema,
  mappingSource: z.enum(['given', 'saved', 'guessed']),
  rows: z.array(previewRowSchema),
  modeDays: z.array(z.object({ row: z.number(), logDate: z.string(), status: z.enum(ROW_STATUSES), values: modeHoursValuesSchema })),
  counts: z.object({ total: z.number(), new: z.number(), changed: z.number(), unchanged: z.number(), rejected: z.number() }),
});
export type Preview = z.infer<typeof previewSchema>;

export const logImportSchema = z.object({
  id: z.uuid(),
  fileName: z.string(),
  fileSha256: z.string(),
  userName: z.string().nullable(),
  createdAt: z.string(),
  rowsNew: z.number(),
  rowsChanged: z.number(),
  rowsUnchanged: z.number(),
  rowsRejected: z.number(),
  status: z.enum(['committed', 'undone']),
  undoneAt: z.string().nullable(),
});
export type LogImport = z.infer<typeof logImportSchema>;

// ---------------------------------------------------------------------------------------------------------------
// Meter replacements, mode hours, fuel lots

export const meterReplacementInputSchema = z.object({
  gensetId: z.uuid('Choose a genset'),
  meter: z.enum(['running_hours', 'kwh']),
  replacedOn: z.iso.date('Enter the date as YYYY-MM-DD'),
  oldFinalReading: z.number({ message: 'Enter the old meter final reading' }).min(0),
  newStartReading: z.number({ message: 'Enter the new meter start reading' }).min(0),
  remarks: z.string().trim().max(300).nullable().default(null),
});
export type MeterReplacementInput = z.input<typeof meterReplacementInputSchema>;
export const meterReplacementSchema = meterReplacementInputSchema.extend({ id: z.uuid(), designation: z.string() });
export type MeterReplacementRow = z.infer<typeof meterReplacementSchema>;

export const modeHoursInputSchema = modeHoursValuesSchema
  .extend({
    seaH: z.number().min(0).max(25).default(0),
    manoeuvringH: z.number().min(0).max(25).default(0),
    portH: z.number().min(0).max(25).default(0),
    anchorageH: z.number().min(0).max(25).default(0),
    shorePowerH: z.number().min(0).max(25).default(0),
  })
  .refine((m) => m.seaH + m.manoeuvringH + m.portH + m.anchorageH + m.shorePowerH <= 25, {
    path: ['seaH'],
    message: 'Mode hours of one day add up to at most 25 h (24 h, 25 h on a day the clocks are retarded)',
  });
export type ModeHoursInput = z.input<typeof modeHoursInputSchema>;
export const modeHoursRowSchema = modeHoursValuesSchema.extend({ logDate: z.string() });
export type ModeHoursRow = z.infer<typeof modeHoursRowSchema>;

export const fuelLotInputSchema = z.object({
  reference: z.string().trim().min(1, 'Enter the delivery note number or a lot name').max(60),
  grade: z.enum(FUEL_GRADES),
  density15KgPerM3: z.number({ message: 'Density must be a number' }).min(400, 'Density at 15 °C below 400 kg/m³ is not a marine fuel').max(1100, 'Density at 15 °C above 1100 kg/m³ is not a marine fuel'),
  /** MJ/kg; when null it is estimated (ISO 8217 annex) and marked estimated. */
  lcvMjPerKg: z.number().min(10).max(60).nullable().default(null),
  sulphurPct: z.number().min(0).max(5).nullable().default(null),
  quantityT: z.number().positive().max(100_000).nullable().default(null),
  deliveredOn: z.iso.date('Enter the date as YYYY-MM-DD'),
});
export type FuelLotInput = z.input<typeof fuelLotInputSchema>;

export const fuelLotSchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  reference: z.string(),
  grade: z.string(),
  density15KgPerM3: z.number(),
  lcvMjPerKg: z.number(),
  lcvEstimated: z.boolean(),
  sulphurPct: z.number().nullable(),
  quantityT: z.number().nullable(),
  deliveredOn: z.string(),
  attachment: z.object({ name: z.string(), type: z.string(), bytes: z.number() }).nullable(),
});
export type FuelLotRow = z.infer<typeof fuelLotSchema>;

export const INTAKE_LIMITS = {
  csvMaxBytes: 20 * 1024 * 1024,
  attachmentMaxBytes: 10 * 1024 * 1024,
  attachmentTypes: ['application/pdf', 'image/png', 'image/jpeg'],
} as const;
