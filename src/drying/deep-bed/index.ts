/**
 * @module drying/deep-bed
 * Natural-air and low-temperature bin drying of grain: airflow resistance and fan power (ASAE D272 form), the
 * equilibrium layer model, and the adapter from a product profile.
 */
export * from './airflow-resistance.ts'
export * from './bin-assessment.ts'
export * from './bin-run.ts'
export * from './bin-summary.ts'
export * from './fan-control.ts'
export * from './grain-from-profile.ts'
export * from './grain-tables.ts'
export * from './layer-model.ts'
export * from './reference-model.ts'
