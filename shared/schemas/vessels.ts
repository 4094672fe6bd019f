import { z } from 'zod';

export const VESSEL_TYPES = ['container ship', 'bulk carrier', 'oil tanker', 'chemical tanker', 'ro-ro passenger', 'offshore supply', 'cruise ship', 'general cargo'] as const;
export const FUEL_GRADES = ['MGO', 'MDO', 'VLSFO', 'HFO', 'LNG'] as const;
export const fuelGradeSchema = z.enum(FUEL_GRADES);

export const vesselInputSchema = z.object({
  name: z.string().trim().min(1, 'Enter the vessel name').max(80),
  imoNumber: z.string().trim().regex(/^\d{7}$/, 'A ship number has seven digits'),
  vesselType: z.enum(VESSEL_TYPES),
  fuelGrades: z.array(fuelGradeSchema).min(1, 'Choose at least one fuel grade'),
  busSections: z.array(z.string().trim().min(1).max(20)).min(1).max(4).default(['A']),
});
export type VesselInput = z.input<typeof vesselInputSchema>;
export const vesselUpdateSchema = vesselInputSchema.omit({ busSections: true }).partial();
export type VesselUpdate = z.infer<typeof vesselUpdateSchema>;

const pct = (label: string) => z.number({ message: `${label} must be a number` }).min(0).max(110);
const sfoc = z.number().min(150, 'SFOC below 150 g/kWh is not plausible').max(450, 'SFOC above 450 g/kWh is not plausible').nullable();

export const shopTestSfocSchema = z.object({ p25: sfoc, p50: sfoc, p75: sfoc, p85: sfoc, p100: sfoc });

export const maintenanceInputSchema = z.object({
  kind: z.string().trim().min(1).max(60),
  intervalHours: z.number().positive('Interval must be above 0 h'),
  intervalMonths: z.number().int().positive().nullable().default(null),
  lastDoneRunningHours: z.number().min(0).nullable().default(null),
  lastDoneOn: z.iso.date().nullable().default(null),
});

export const gensetInputSchema = z
  .object({
    designation: z.string().trim().min(1, 'Enter a designation such as DG1').max(20),
    /** The main switchboard section a service set feeds; an emergency set feeds the emergency switchboard (null). */
    busSectionId: z.uuid('Choose a bus section').nullable(),
    ratedKw: z.number({ message: 'Rated power must be a number' }).positive('Rated power must be above 0 kW').max(50_000),
    ratedKva: z.number().positive().max(60_000),
    voltageV: z.number().positive().max(15_000),
    frequencyHz: z.union([z.literal(50), z.literal(60)]),
    speedClass: z.enum(['high', 'medium', 'low']),
    minLoadPct: pct('Minimum load'),
    maxLoadPct: pct('Maximum continuous load'),
    startCostKg: z.number().min(0).default(0),
    minUpH: z.number().min(0).max(48).default(0),
    minDownH: z.number().min(0).max(48).default(0),
    shopTestSfoc: shopTestSfocSchema,
    duty: z.enum(['service', 'emergency']).default('service'),
    maintenance: z.array(maintenanceInputSchema).default([]),
  })
  .refine((g) => g.duty === 'emergency' || g.busSectionId !== null, { message: 'A service set feeds a bus section', path: ['busSectionId'] })
  .refine((g) => g.maxLoadPct > g.minLoadPct, { message: 'Maximum load must be above minimum load', path: ['maxLoadPct'] })
  .refine((g) => g.ratedKva >= g.ratedKw, { message: 'Rated kVA cannot be below rated kW (power factor ≤ 1)', path: ['ratedKva'] });
export type GensetInput = z.input<typeof gensetInputSchema>;

export const busSectionSchema = z.object({ id: z.uuid(), name: z.string(), sortOrder: z.number() });
export const maintenanceSchema = maintenanceInputSchema.extend({ id: z.uuid() });
export const gensetSchema = z.object({
  id: z.uuid(),
  vesselId: z.uuid(),
  designation: z.string(),
  busSectionId: z.uuid().nullable(),
  ratedKw: z.number(),
  ratedKva: z.number(),
  voltageV: z.number(),
  frequencyHz: z.number(),
  speedClass: z.enum(['high', 'medium', 'low']),
  minLoadPct: z.number(),
  maxLoadPct: z.number(),
  startCostKg: z.number(),
  minUpH: z.number(),
  minDownH: z.number(),
  shopTestSfoc: shopTestSfocSchema,
  duty: z.enum(['service', 'emergency']),
  maintenance: z.array(maintenanceSchema),
  latestRunningHours: z.number().nullable(),
});
export type Genset = z.infer<typeof gensetSchema>;

export const vesselSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  imoNumber: z.string(),
  vesselType: z.string(),
  fuelGrades: z.array(z.string()),
  gensetCount: z.number(),
  installedKw: z.number(),
  lastLogDate: z.string().nullable(),
});
export type VesselSummary = z.infer<typeof vesselSummarySchema>;

export const vesselDetailSchema = vesselSummarySchema.extend({
  busSections: z.array(busSectionSchema),
  gensets: z.array(gensetSchema),
});
export type VesselDetail = z.infer<typeof vesselDetailSchema>;
