import { z } from 'zod';

/**
 * Divergence alerts (DESIGN.md §3): drift rules, alerts and their timeline, the on-call rota,
 * alert settings and the alert-load report. Times are ISO 8601 UTC strings.
 */
const Iso = z.iso.datetime({ offset: true });
const Finite = z.number().refine(Number.isFinite, 'must be a finite number');
const Positive = Finite.refine((v) => v > 0, 'must be greater than 0');

export const DRIFT_RULE_KINDS = ['band', 'cusum', 'nis', 'stale'] as const;
export const DriftRuleKindSchema = z.enum(DRIFT_RULE_KINDS);
export type DriftRuleKind = z.infer<typeof DriftRuleKindSchema>;

/** What raised an alert: a drift rule, or `model` — the active version itself is unstable. */
export const ALERT_RULE_KINDS = [...DRIFT_RULE_KINDS, 'model'] as const;
export const AlertRuleKindSchema = z.enum(ALERT_RULE_KINDS);
export type AlertRuleKind = z.infer<typeof AlertRuleKindSchema>;

export const PrioritySchema = z.union([z.literal(1), z.literal(2), z.literal(3)]);
export type Priority = z.infer<typeof PrioritySchema>;

/**
 * Residual standard deviation per output, in the output's unit, as measured when the model was
 * validated (or taken from the loop's running residual statistics). Standardises residuals for
 * `band` in sigma mode, `cusum`, and `nis` when the correction has no innovation covariance.
 */
const Sigma = z.array(Positive).min(1).max(50);

/**
 * band: |r_i| > limit_i for `raiseAfter` consecutive samples raises; it clears after `clearAfter`
 * consecutive samples with every |r_i| < limit_i·(1 − deadband).
 * limit_i = `limits[i]` (absolute, output units; null: that output is not watched) or `k`·sigma_i.
 */
export const BandParamsSchema = z
  .object({
    mode: z.enum(['absolute', 'sigma']),
    limits: z.array(Positive.nullable()).min(1).max(50).optional(),
    k: Positive.optional(),
    sigma: Sigma.optional(),
    raiseAfter: z.number().int().min(1).max(10_000),
    clearAfter: z.number().int().min(1).max(10_000),
    deadband: z.number().min(0).max(0.9),
  })
  .superRefine((p, ctx) => {
    if (p.mode === 'absolute' && !p.limits)
      ctx.addIssue({ code: 'custom', path: ['limits'], message: 'absolute mode needs one limit per output' });
    if (p.mode === 'sigma' && (p.k === undefined || !p.sigma))
      ctx.addIssue({
        code: 'custom',
        path: [p.k === undefined ? 'k' : 'sigma'],
        message: 'sigma mode needs k and sigma',
      });
  });

/**
 * cusum: two-sided CUSUM on each output's standardised residual z = r/sigma (engine cusumStep),
 * reference value k and decision interval h in sigma units; clears when both sums fall back to 0.
 * `shift` (sigma units) is only for the detection delay shown in the editor.
 */
export const CusumParamsSchema = z.object({
  k: z.number().min(0).max(5),
  h: z.number().positive().max(50),
  sigma: Sigma,
  shift: z.number().positive().max(10).default(1),
});

/**
 * nis: rᵀ S⁻¹ r above the chi-square (p outputs degrees of freedom) quantile 1 − falseAlarmProbability
 * for `raiseAfter` consecutive samples; S is the Kalman correction's innovation covariance
 * C P Cᵀ + R, else diag(sigma²). Clears after `clearAfter` samples below the limit.
 */
export const NisParamsSchema = z.object({
  falseAlarmProbability: z.number().min(1e-9).max(0.5),
  raiseAfter: z.number().int().min(1).max(10_000),
  clearAfter: z.number().int().min(1).max(10_000),
  sigma: Sigma.optional(),
});

/** stale: no reading for `afterSamples` sample periods. */
export const StaleParamsSchema = z.object({ afterSamples: z.number().int().min(1).max(100_000) });

export type BandParams = z.infer<typeof BandParamsSchema>;
export type CusumParams = z.infer<typeof CusumParamsSchema>;
export type NisParams = z.infer<typeof NisParamsSchema>;
export type StaleParams = z.infer<typeof StaleParamsSchema>;
export type DriftRuleParams = BandParams | CusumParams | NisParams | StaleParams;

export const PARAMS_SCHEMAS = {
  band: BandParamsSchema,
  cusum: CusumParamsSchema,
  nis: NisParamsSchema,
  stale: StaleParamsSchema,
} as const;

/** What an engineer should expect of a rule at the loop's sample period (engine cusumArl etc.). */
export const RuleExpectationSchema = z.object({
  /** Mean samples between false alerts with the model right (in-control ARL); null when not computable. */
  falseAlertIntervalSamples: z.number().nullable(),
  falseAlertIntervalHours: z.number().nullable(),
  /** Mean samples to raise after a shift of `shiftSigma` (out-of-control ARL); null when not applicable. */
  detectionDelaySamples: z.number().nullable(),
  shiftSigma: z.number().nullable(),
  /** One sentence in plain words, e.g. "about one false alert every 9 days at this sample period". */
  sentence: z.string(),
});
export type RuleExpectation = z.infer<typeof RuleExpectationSchema>;

export const DriftRuleSchema = z.object({
  id: z.uuid(),
  loopId: z.uuid(),
  kind: DriftRuleKindSchema,
  enabled: z.boolean(),
  priority: PrioritySchema,
  params: z.record(z.string(), z.unknown()),
  version: z.number().int(),
  updatedAt: z.string(),
  updatedBy: z.string().nullable(),
  expectation: RuleExpectationSchema,
});
export type DriftRule = z.infer<typeof DriftRuleSchema>;

/** PUT /api/v1/loops/{loopId}/drift-rules/{kind}: creates or replaces (a new version); params per kind. */
export const SaveDriftRuleBodySchema = z.object({
  enabled: z.boolean(),
  priority: PrioritySchema,
  params: z.record(z.string(), z.unknown()),
  note: z.string().trim().max(2000).default(''),
});
export type SaveDriftRuleBody = z.input<typeof SaveDriftRuleBodySchema>;

/** POST /api/v1/loops/{loopId}/drift-rules/preview: the expectation of unsaved params. */
export const PreviewDriftRuleBodySchema = z.object({
  kind: DriftRuleKindSchema,
  params: z.record(z.string(), z.unknown()),
});

export const DriftRuleVersionSchema = z.object({
  version: z.number().int(),
  enabled: z.boolean(),
  priority: PrioritySchema,
  params: z.record(z.string(), z.unknown()),
  note: z.string(),
  changedAt: z.string(),
  changedBy: z.string().nullable(),
});

/**
 * GET /api/v1/loops/{loopId}/drift-rules/suggest: each output's residual standard deviation from the
 * loop's running residual statistics, for the editor's sigma fields.
 */
export const DriftRuleSuggestionSchema = z.object({
  residualCount: z.number().int(),
  /** Residuals needed before sigma is suggested. */
  minimumCount: z.number().int(),
  outputs: z.array(
    z.object({ name: z.string(), unit: z.string(), mean: z.number().nullable(), sigma: z.number().nullable() }),
  ),
  /** One value per output, ready for params.sigma; null until every output has one. */
  sigma: z.array(z.number()).nullable(),
  sentence: z.string(),
});
export type DriftRuleSuggestion = z.infer<typeof DriftRuleSuggestionSchema>;

export const ALERT_STATES = ['unacknowledged', 'acknowledged', 'returned_unacknowledged', 'shelved', 'closed'] as const;
export const AlertStateSchema = z.enum(ALERT_STATES);
export type AlertState = z.infer<typeof AlertStateSchema>;

export const CLOSE_CAUSES = ['sensor_fault', 'actuator_fault', 'process_change', 'model_out_of_date', 'other'] as const;
export const CloseCauseSchema = z.enum(CLOSE_CAUSES);
export type CloseCause = z.infer<typeof CloseCauseSchema>;

const Person = z.object({ id: z.uuid(), name: z.string(), email: z.string() });
export type Person = z.infer<typeof Person>;

/** Which signals carry the residual and how it projects onto the model's modes, with the hint. */
export const ResidualDirectionSchema = z.object({
  /** Per output: its share of the standardised residual's energy (0…1), largest first. */
  signals: z.array(
    z.object({ index: z.number().int(), name: z.string(), unit: z.string(), share: z.number(), residual: z.number() }),
  ),
  /** Per mode (left-eigenvector projection of the state-space residual), largest share first. */
  modes: z.array(z.object({ eigenvalue: z.object({ re: z.number(), im: z.number() }), share: z.number() })),
  /** 'sensor' | 'process' | 'unclear', and the sentence shown to people. */
  points: z.enum(['sensor', 'process', 'unclear']),
  hint: z.string(),
});
export type ResidualDirection = z.infer<typeof ResidualDirectionSchema>;

/** The values at the raise, with units, for people and e-mail. */
export const AlertDetailSchema = z.object({
  /** e.g. "|residual| / limit", "CUSUM upper sum", "NIS", "samples without a reading". */
  statistic: z.string().optional(),
  value: z.number().nullable().optional(),
  limit: z.number().nullable().optional(),
  /** Per output at the raise: measured, predicted, residual (output units). */
  signals: z
    .array(
      z.object({
        name: z.string(),
        unit: z.string(),
        measured: z.number().nullable(),
        predicted: z.number().nullable(),
        residual: z.number().nullable(),
        limit: z.number().nullable().optional(),
      }),
    )
    .optional(),
  slotAt: z.string().optional(),
});
export type AlertDetail = z.infer<typeof AlertDetailSchema>;

export const AlertSchema = z.object({
  id: z.uuid(),
  number: z.number().int(),
  loopId: z.uuid(),
  loopTag: z.string(),
  loopName: z.string(),
  area: z.string(),
  rule: AlertRuleKindSchema,
  ruleId: z.uuid().nullable(),
  ruleVersion: z.number().int().nullable(),
  priority: PrioritySchema,
  state: AlertStateSchema,
  /** The condition is present now. */
  active: z.boolean(),
  raisedAt: z.string(),
  /** When the condition became present the last time: the raise, or the latest re-raise. */
  activeSince: z.string(),
  clearedAt: z.string().nullable(),
  activations: z.number().int(),
  acknowledgedAt: z.string().nullable(),
  acknowledgedBy: Person.nullable(),
  shelvedUntil: z.string().nullable(),
  shelveReason: z.string().nullable(),
  closedAt: z.string().nullable(),
  closedBy: Person.nullable(),
  closeCause: CloseCauseSchema.nullable(),
  closeNote: z.string().nullable(),
  /** What happened, in one sentence. */
  summary: z.string(),
  detail: AlertDetailSchema,
  direction: ResidualDirectionSchema.nullable(),
  escalationLevel: z.number().int(),
  updatedAt: z.string(),
});
export type Alert = z.infer<typeof AlertSchema>;

export const ALERT_EVENT_KINDS = [
  'raised',
  'reactivated',
  'cleared',
  'acknowledged',
  'shelved',
  'unshelved',
  'closed',
  'notified',
  'escalated',
] as const;
export const AlertEventSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  kind: z.enum(ALERT_EVENT_KINDS),
  actor: Person.nullable(),
  fromState: AlertStateSchema.nullable(),
  toState: AlertStateSchema.nullable(),
  note: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
});
export type AlertEvent = z.infer<typeof AlertEventSchema>;

export const AlertWithEventsSchema = AlertSchema.extend({ events: z.array(AlertEventSchema) });
export type AlertWithEvents = z.infer<typeof AlertWithEventsSchema>;

const csv = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(item));

export const AlertListQuerySchema = z.object({
  /** One state or several, comma-separated; `open` means every state but closed. */
  state: csv(z.union([AlertStateSchema, z.literal('open')])).optional(),
  area: z.string().optional(),
  loopId: z.uuid().optional(),
  priority: csv(z.coerce.number().int().min(1).max(3)).optional(),
  from: Iso.optional(),
  to: Iso.optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  /**
   * `newest` (default): newest first raise first. `urgent`: active and unacknowledged, then cleared
   * but unacknowledged, acknowledged and active, shelved, acknowledged and cleared, closed; within
   * each P1 first, then the latest raise or re-raise. The limit applies after the order.
   */
  order: z.enum(['newest', 'urgent']).default('newest'),
});

export const AcknowledgeBodySchema = z.object({ note: z.string().trim().max(2000).default('') });
export const BulkAcknowledgeBodySchema = z.object({
  ids: z.array(z.uuid()).min(1).max(500),
  note: z.string().trim().max(2000).default(''),
});
export const ShelveBodySchema = z.object({
  note: z.string().trim().min(1, 'say why the alert is shelved').max(2000),
  until: Iso,
});
export const CloseBodySchema = z.object({
  cause: CloseCauseSchema,
  note: z.string().trim().min(1, 'say what was found or done').max(4000),
});
export const BulkAcknowledgeResultSchema = z.object({
  acknowledged: z.array(z.uuid()),
  skipped: z.array(z.object({ id: z.uuid(), reason: z.string() })),
});

export const SHIFT_POSITIONS = ['primary', 'secondary'] as const;
export const ShiftSchema = z.object({
  id: z.uuid(),
  user: Person,
  /** null: plant-wide. */
  area: z.string().nullable(),
  position: z.enum(SHIFT_POSITIONS),
  startsAt: z.string(),
  endsAt: z.string(),
  note: z.string(),
});
export type Shift = z.infer<typeof ShiftSchema>;
export const SaveShiftBodySchema = z
  .object({
    userId: z.uuid(),
    area: z.string().min(1).nullable(),
    position: z.enum(SHIFT_POSITIONS),
    startsAt: Iso,
    endsAt: Iso,
    note: z.string().trim().max(500).default(''),
  })
  .refine((s) => Date.parse(s.endsAt) > Date.parse(s.startsAt), {
    path: ['endsAt'],
    message: 'must be after startsAt',
  });
export const ShiftListQuerySchema = z.object({ from: Iso, to: Iso });

/** Who is on call at one time: plant-wide and per area (an area's own shift wins over plant-wide). */
export const OnCallNowSchema = z.object({
  at: z.string(),
  primary: Person.nullable(),
  secondary: Person.nullable(),
  areas: z.array(z.object({ area: z.string(), primary: Person.nullable(), secondary: Person.nullable() })),
});
export type OnCallNow = z.infer<typeof OnCallNowSchema>;

export const AlertSettingsSchema = z.object({
  secondaryAfterMin: z.number().int().min(1).max(1440),
  areaAfterMin: z.number().int().min(2).max(2880),
  ackLinkTtlMin: z.number().int().min(5).max(10_080),
  shelveMaxHours: z.number().int().min(1).max(720),
  targetPerDay: z.number().int().min(1).max(100_000),
  targetPer10Min: z.number().int().min(1).max(1000),
  floodPer10Min: z.number().int().min(1).max(10_000),
});
export type AlertSettings = z.infer<typeof AlertSettingsSchema>;

export const AreaEngineersSchema = z.array(z.object({ area: z.string(), engineers: z.array(Person) }));

export const AlertLoadQuerySchema = z.object({ from: Iso.optional(), to: Iso.optional() });
export const AlertLoadSchema = z.object({
  from: z.string(),
  to: z.string(),
  targets: z.object({ perDay: z.number(), per10Min: z.number(), floodPer10Min: z.number() }),
  /** Alert activations (raises and re-raises) per plant day. */
  perDay: z.array(z.object({ day: z.string(), count: z.number().int() })),
  /** Per 10-minute window that had any. */
  per10Min: z.array(z.object({ start: z.string(), count: z.number().int() })),
  /** Share of 10-minute windows over the per-10-min target. */
  windowsOverTargetPercent: z.number(),
  floods: z.array(z.object({ start: z.string(), end: z.string(), count: z.number().int() })),
  /** Repeats of the same alert within a minute of its previous clear. */
  chattering: z.array(
    z.object({ alertId: z.uuid(), loopTag: z.string(), rule: AlertRuleKindSchema, repeats: z.number().int() }),
  ),
  /** Active longer than a day and not closed. */
  stale: z.array(
    z.object({
      alertId: z.uuid(),
      loopTag: z.string(),
      rule: AlertRuleKindSchema,
      raisedAt: z.string(),
      hours: z.number(),
    }),
  ),
  topLoops: z.array(z.object({ loopId: z.uuid(), loopTag: z.string(), loopName: z.string(), count: z.number().int() })),
  meanTimeToAcknowledgeS: z.number().nullable(),
  /** Alerts raised in the range and acknowledged since: the alerts the mean is taken over. */
  acknowledgedAlerts: z.number().int(),
  /** Every 10-minute window the range touches (the denominator of windowsOverTargetPercent). */
  windowCount: z.number().int(),
  /** Stale means active for more than 24 h at this instant: the end of the range, or now if earlier. */
  staleAsOf: z.string(),
  total: z.number().int(),
});
export type AlertLoad = z.infer<typeof AlertLoadSchema>;

/** A person, as shifts, alerts and area engineers show them. */
export const PersonSchema = Person;
/** POST /api/v1/oncall/shifts/{id}/swap: the two shifts exchange their people. */
export const SwapShiftBodySchema = z.object({ withShiftId: z.uuid() });
export const OnCallNowQuerySchema = z.object({ at: Iso.optional() });
/** Someone who may take shifts (holds the oncall or admin role), for the shift editor's picker. */
export const RotaPersonSchema = Person.extend({ roles: z.array(z.string()) });
export type RotaPerson = z.infer<typeof RotaPersonSchema>;
export const AreaEngineersEntrySchema = z.object({ area: z.string(), engineers: z.array(Person) });
/** PUT /api/v1/oncall/area-engineers/{area}: replaces the area's engineers (each must hold the engineer role). */
export const SetAreaEngineersBodySchema = z.object({ userIds: z.array(z.uuid()).max(50) });
/** PUT /api/v1/alert-settings: every field; the area step must come after the secondary step. */
export const SaveAlertSettingsBodySchema = AlertSettingsSchema.superRefine((s, ctx) => {
  if (s.areaAfterMin <= s.secondaryAfterMin)
    ctx.addIssue({
      code: 'custom',
      path: ['areaAfterMin'],
      message: `must be greater than secondaryAfterMin (${s.secondaryAfterMin} min): the area's engineers are called after the secondary`,
    });
});

/** PUT /api/v1/loops/{loopId}/maintenance: in maintenance, raises are recorded and nobody is called. */
export const LoopMaintenanceBodySchema = z.object({
  maintenance: z.boolean(),
  note: z.string().trim().min(1, 'say why (e.g. the work order)').max(2000),
});
export const LoopMaintenanceSchema = z.object({
  loopId: z.uuid(),
  loopTag: z.string(),
  maintenance: z.boolean(),
});
export type LoopMaintenance = z.infer<typeof LoopMaintenanceSchema>;

/** A raise while the loop was in maintenance: recorded, nobody called. */
export const AlertSuppressionSchema = z.object({
  id: z.number().int(),
  loopId: z.uuid(),
  rule: AlertRuleKindSchema,
  at: z.string(),
  summary: z.string(),
  detail: AlertDetailSchema,
});
export type AlertSuppression = z.infer<typeof AlertSuppressionSchema>;
export const AlertSuppressionQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
});
