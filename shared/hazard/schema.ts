import { z } from 'zod'

/** A [longitude, latitude] pair in degrees (WGS84). */
export const lonLatSchema = z.tuple([
  z.number().min(-180).max(180),
  z.number().min(-90).max(90),
])
export type LonLat = z.infer<typeof lonLatSchema>

/** Taxonomic class of the impactor; `unknown` selects the albedo mixture of Wright et al. 2016. */
export const taxonomicClassSchema = z.enum(['S', 'C', 'M', 'Q', 'V', 'unknown'])
export type TaxonomicClass = z.infer<typeof taxonomicClassSchema>

const meanSigma = (min: number, max: number, sigmaMax: number) => z.object({
  mean: z.number().min(min).max(max),
  sigma: z.number().min(0).max(sigmaMax),
})

/**
 * The close-encounter geometry an orbit solution was computed from, as the hazard engine reads it when it draws
 * impacts from the approach (`sampling: 'encounter'`): the radiant, v∞, the nominal body's arrival time and its
 * b-plane point with the Gaussian uncertainty (σ along the line of variations, σ across, the line's angle). Axes and
 * sources: shared/encounter/README.md. A scenario gives it as the solution entry's `encounter:` block.
 */
export const solutionEncounterSchema = z.object({
  vInfKmS: z.number().min(1).max(70),
  radiant: z.object({ raDeg: z.number().min(0).max(360), decDeg: z.number().min(-90).max(90) }),
  timeUtc: z.iso.datetime({ offset: true }),
  nominal: z.object({ xiKm: z.number().min(-400_000).max(400_000), zetaKm: z.number().min(-400_000).max(400_000) }),
  sigmaAlongKm: z.number().min(0).max(1_000_000),
  sigmaAcrossKm: z.number().min(0).max(100_000),
  lineAngleDeg: z.number().min(-360).max(360),
})
export type SolutionEncounter = z.infer<typeof solutionEncounterSchema>

/** Where the Monte Carlo takes each realisation's impact point, entry angle and speed from (see README, Sampling). */
export const SOLUTION_SAMPLING = ['corridor', 'encounter'] as const
export type SolutionSampling = typeof SOLUTION_SAMPLING[number]

/**
 * What is known of the impactor at one scenario time: an orbit solution.
 * Units are in the field names; angles from the horizontal (90 = vertical).
 */
export const orbitSolutionSchema = z.object({
  /** Solution epoch (ISO 8601): when this estimate was made, in scenario time. */
  epoch: z.iso.datetime({ offset: true }),
  /** Nominal impact time (ISO 8601). */
  impactTime: z.iso.datetime({ offset: true }),
  /** Impact probability, 0..1. */
  impactProbability: z.number().min(0).max(1),
  /** Absolute magnitude H and its 1-sigma. */
  magnitude: z.object({ H: z.number().min(10).max(35), sigma: z.number().min(0).max(3) }),
  /** Geometric albedo range (uniform between min and max); overrides the class albedo. */
  albedo: z.object({ min: z.number().gt(0).max(1), max: z.number().gt(0).max(1) })
    .refine(a => a.min <= a.max, { message: 'albedo.min must not exceed albedo.max' })
    .optional(),
  taxonomicClass: taxonomicClassSchema.default('unknown'),
  /** Bulk density mean and 1-sigma in kg/m³; absent: from the class. */
  densityKgM3: meanSigma(500, 8000, 3000).optional(),
  /** Entry speed at the top of the atmosphere, km/s. */
  entrySpeedKmS: meanSigma(11.2, 72, 20),
  /** Entry angle from the horizontal, degrees; absent: the sin 2θ law. */
  entryAngleDeg: meanSigma(5, 90, 45).optional(),
  /** The risk corridor: ground track, cross-track half-width, nominal point, along-track spread. */
  corridor: z.object({
    // A drawn ground track: 2 000 points is far more than any corridor needs and keeps a preview quick.
    path: z.array(lonLatSchema).min(2).max(2000),
    halfWidthKm: z.number().min(0).max(5000),
    nominal: lonLatSchema,
    alongTrackSigmaKm: z.number().min(0).max(20000),
  }),
  /** Water depth at the nominal impact point, metres (0 on land). */
  waterDepthM: z.number().min(0).max(11000),
  /**
   * Where the Monte Carlo draws the impacts from: `corridor` (default) the risk corridor band with the speed and angle
   * above; `encounter` b-plane points of `encounter` (hits only), each giving its own point, angle and speed.
   */
  sampling: z.enum(SOLUTION_SAMPLING).optional(),
  /**
   * The encounter the solution comes from; read only with `sampling: 'encounter'`. A scenario file gives it beside
   * the solution (the entry's `encounter:`), and the engine's caller joins the two (shared/scenario/encounter.ts).
   */
  encounter: solutionEncounterSchema.optional(),
}).refine(s => s.sampling !== 'encounter' || s.encounter !== undefined, {
  path: ['sampling'], message: 'drawing impacts from the encounter needs the solution\'s encounter',
})
export type OrbitSolution = z.infer<typeof orbitSolutionSchema>
export type OrbitSolutionInput = z.input<typeof orbitSolutionSchema>

/** A place of interest: a coastal or inland town, a port, a facility. */
export const siteSchema = z.object({
  id: z.string().regex(/^[a-z0-9][a-z0-9-]{0,62}$/, 'lower-case letters, digits and dashes'),
  name: z.string().min(1).max(120),
  lon: z.number().min(-180).max(180),
  lat: z.number().min(-90).max(90),
  population: z.number().int().min(0).max(50_000_000),
  /**
   * Water depth offshore of the site where the wave is measured, metres: the seaward end of the site's
   * shore profile. Given: the site is coastal and gets tsunami figures; absent: inland.
   */
  offshoreDepthM: z.number().min(1).max(11000).optional(),
  /** Slope of the beach from its toe (10 m deep, or the offshore depth if shallower) to the shore, degrees; default 1. */
  beachSlopeDeg: z.number().gt(0).max(45).optional(),
  /**
   * Width of the shelf in front of the site, km: the horizontal distance over which the sea floor rises
   * from `offshoreDepthM` to the toe of the beach. Absent: 10 km (see shared/hazard/README.md).
   */
  shelfWidthKm: z.number().gt(0).max(500).optional(),
  /**
   * False for an offshore installation (a platform, a wind array): the wave counts at its depth, but it has no beach
   * to run up. Absent: a coastal site has a shore.
   */
  shore: z.boolean().optional(),
})
export type Site = z.infer<typeof siteSchema>
