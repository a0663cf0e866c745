import {describe, expect, it} from 'vitest';
import type {Outcome, Verdict} from '../../source/rules/evaluate/evaluation.js';
import {checkResult, evaluateDocument, expectClose, readAnswers, readDemo, shippedRules, withChanges, type AnswersDocument, type Changes} from './bench-answers.js';

// Every case starts from the clearing demo and changes one or two inputs. The demo in
// hand arithmetic (policy: current_margin 10 %, power_margin 10 %, headroom_margin 0.5 V,
// min_emission_delay 3 s, min_soft_start 10 ms):
//   current_ceiling      = 2.5 A × (1 − 0.10)                        = 2.25 A
//   modulation_peak      = 0.1 A/V × 2 V                             = 0.2 A
//   supply_low / high    = 5 V × 0.95 / 5 V × 1.05                   = 4.75 V / 5.25 V
//   forward_voltage      = 1.6 V + 0.15 Ω × 2 A                      = 1.9 V
//   path_drop            = 2 A × (0.05 Ω + 0.1 Ω) + 0.8 V            = 1.1 V
//   compliance_available = 4.75 V − 1.1 V                            = 3.65 V
//   regulation_floor     = 1.9 V + 1.1 V                             = 3.0 V
//   worst_dissipation    : I* = (5.25 − 1.6)/(2 × 0.15) = 12.17 A > 2 A, so at the limit:
//                          (5.25 − 1.6 − 0.15 × 2) × 2              = 6.7 W
//   fault_dissipation    = 5.25 V × 2 A                              = 10.5 W
//   allowed_dissipation  = 10 W × (125 − 35)/(125 − 25)              = 9 W
//   threshold_cold       = 0.45 A × exp((15 − 25)/140)  = 0.45 × 0.9310628 = 0.4189783 A
//   power_at_limit_cold  = 1.1 W/A × (2 A − 0.4189783 A)            = 1.7391239 W
const rules = shippedRules();
const clear = readDemo('bench3-808nm-clear.yaml');

// The same bench in constant-power mode (the inputs of the incomplete demo, with a measured
// responsivity of 1 mA/W): monitor_current = 1 mA/W × 1.5 W = 1.5 mA;
// power ceiling = 2 W × (1 − 0.10) = 1.8 W.
const constantPower = withChanges(
	clear,
	{control_mode: 'constant_power', current_setpoint: null, modulation_gain: null, modulation_source_peak: null, power_setpoint: '1.5 W', photodiode_responsivity: '1 mA/W', monitor_input_max: '2 mA'},
	{responsivity_measured: 'yes'},
);
// The demo with only the output beam, and with a third beam (a 1064 nm pump leak: 0.5 W, no
// exit diameter, 0 at the eye, 10 mrad at the 1/e points, eyewear OD 4).
const singleBeam = withChanges(clear, {second_beam: 'no', beam2_wavelength: null, beam2_power: null, beam2_diameter: null, beam2_eye_diameter: null, beam2_divergence: null, beam2_divergence_convention: null, beam2_eyewear_od: null, third_beam: null});
const threeBeams = withChanges(clear, {third_beam: 'yes', beam3_wavelength: '1064 nm', beam3_power: '0.5 W', beam3_diameter: '0 mm', beam3_eye_diameter: '0 mm', beam3_divergence: '10 mrad', beam3_divergence_convention: 'one_over_e', beam3_eyewear_od: '4'});
const classTwo = withChanges(clear, {laser_class: 'class_2'});
type Base = 'current' | 'power' | 'single' | 'three' | 'class2';
const bases: Record<Base, AnswersDocument> = {current: clear, power: constantPower, single: singleBeam, three: threeBeams, class2: classTwo};

type Kind = 'pass' | 'fail' | 'advise' | 'boundary';
type Comparison = {check: string; kind: Kind; name: string; base?: Base; inputs?: Changes; value: number; limit: number; margin: number; fraction: number};
type Condition = {check: string; kind: Kind; name: string; base?: Base; inputs?: Changes};

// Checks with a value and a limit. Boundary cases put the value exactly on the limit: it must pass.
const comparisons: Comparison[] = [
	// 2 A vs 2.25 A: margin 0.25 A, 0.25/2.25 = 0.1111111
	{check: 'limit_below_diode_maximum', kind: 'pass', name: 'demo limit', value: 2, limit: 2.25, margin: 0.25, fraction: 0.25 / 2.25},
	// 2.4 A vs 2.25 A: margin −0.15 A, −0.15/2.25 = −0.0666667
	{check: 'limit_below_diode_maximum', kind: 'fail', name: 'limit above the ceiling', inputs: {current_limit: '2.4 A'}, value: 2.4, limit: 2.25, margin: -0.15, fraction: -0.15 / 2.25},
	{check: 'limit_below_diode_maximum', kind: 'boundary', name: 'limit equal to 2.5 A less 10 %', inputs: {current_limit: '2.25 A'}, value: 2.25, limit: 2.25, margin: 0, fraction: 0},
	{check: 'limit_below_diode_maximum', kind: 'boundary', name: 'limit entered in milliamperes', inputs: {current_limit: '2250 mA'}, value: 2.25, limit: 2.25, margin: 0, fraction: 0},

	// 2 A vs 5 A: margin 3 A, 3/5 = 0.6
	{check: 'limit_within_driver', kind: 'pass', name: 'demo limit', value: 2, limit: 5, margin: 3, fraction: 0.6},
	// 2 A vs 1.5 A: margin −0.5 A, −0.5/1.5 = −0.3333333
	{check: 'limit_within_driver', kind: 'fail', name: 'driver smaller than the limit', inputs: {driver_max_current: '1.5 A'}, value: 2, limit: 1.5, margin: -0.5, fraction: -0.5 / 1.5},
	{check: 'limit_within_driver', kind: 'boundary', name: 'driver maximum equal to the limit', inputs: {driver_max_current: '2 A'}, value: 2, limit: 2, margin: 0, fraction: 0},

	// 1.6 A vs 2 A: margin 0.4 A, 0.4/2 = 0.2
	{check: 'setpoint_below_limit', kind: 'pass', name: 'demo setpoint', value: 1.6, limit: 2, margin: 0.4, fraction: 0.2},
	// 2.1 A vs 2 A: margin −0.1 A, −0.1/2 = −0.05
	{check: 'setpoint_below_limit', kind: 'fail', name: 'setpoint above the limit', inputs: {current_setpoint: '2.1 A'}, value: 2.1, limit: 2, margin: -0.1, fraction: -0.05},
	{check: 'setpoint_below_limit', kind: 'boundary', name: 'setpoint equal to the limit', inputs: {current_setpoint: '2 A'}, value: 2, limit: 2, margin: 0, fraction: 0},

	// 1.6 A + 0.1 A/V × 2 V = 1.8 A vs 2 A: margin 0.2 A, 0.2/2 = 0.1
	{check: 'setpoint_plus_modulation_below_limit', kind: 'pass', name: 'demo modulation', value: 1.8, limit: 2, margin: 0.2, fraction: 0.1},
	// 1.6 A + 0.1 A/V × 5 V = 2.1 A: margin −0.1 A, −0.05
	{check: 'setpoint_plus_modulation_below_limit', kind: 'fail', name: 'open-circuit peak of 5 V', inputs: {modulation_source_peak: '5 V'}, value: 2.1, limit: 2, margin: -0.1, fraction: -0.05},
	// 1.6 A + 0.1 A/V × 4 V = 2.0 A
	{check: 'setpoint_plus_modulation_below_limit', kind: 'boundary', name: 'setpoint plus modulation equal to the limit', inputs: {modulation_source_peak: '4 V'}, value: 2, limit: 2, margin: 0, fraction: 0},

	// 1.5 W vs 1.8 W: margin 0.3 W, 0.3/1.8 = 0.1666667
	{check: 'power_setpoint_below_maximum', kind: 'pass', name: 'constant-power setpoint', base: 'power', value: 1.5, limit: 1.8, margin: 0.3, fraction: 0.3 / 1.8},
	// 1.9 W vs 1.8 W: margin −0.1 W, −0.1/1.8 = −0.0555556
	{check: 'power_setpoint_below_maximum', kind: 'fail', name: 'setpoint above 2 W less 10 %', base: 'power', inputs: {power_setpoint: '1.9 W'}, value: 1.9, limit: 1.8, margin: -0.1, fraction: -0.1 / 1.8},
	{check: 'power_setpoint_below_maximum', kind: 'boundary', name: 'setpoint equal to 2 W less 10 %', base: 'power', inputs: {power_setpoint: '1.8 W'}, value: 1.8, limit: 1.8, margin: 0, fraction: 0},

	// 1 mA/W × 1.5 W = 1.5 mA vs 2 mA: margin 0.5 mA, 0.5/2 = 0.25
	{check: 'monitor_current_within_input', kind: 'pass', name: 'monitor current at the setpoint', base: 'power', value: 1.5e-3, limit: 2e-3, margin: 0.5e-3, fraction: 0.25},
	// 2 mA/W × 1.5 W = 3 mA vs 2 mA: margin −1 mA, −1/2 = −0.5
	{check: 'monitor_current_within_input', kind: 'fail', name: 'a more sensitive monitor saturates the input', base: 'power', inputs: {photodiode_responsivity: '2 mA/W'}, value: 3e-3, limit: 2e-3, margin: -1e-3, fraction: -0.5},
	{check: 'monitor_current_within_input', kind: 'boundary', name: 'input maximum equal to the monitor current', base: 'power', inputs: {monitor_input_max: '1.5 mA'}, value: 1.5e-3, limit: 1.5e-3, margin: 0, fraction: 0},

	// 1.1 × (2 − 0.45 × exp(−10/140)) = 1.7391239 W vs 2 W: margin 0.2608761 W, 0.1304380
	{check: 'cold_power_at_limit', kind: 'pass', name: 'demo diode at 15 degC', value: 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), limit: 2, margin: 2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), fraction: (2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140))) / 2},
	// 288.15 K is 15 degC: the same 1.7391239 W
	{check: 'cold_power_at_limit', kind: 'pass', name: 'coldest case entered in kelvin', inputs: {diode_temperature_min: '288.15 K'}, value: 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), limit: 2, margin: 2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), fraction: (2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140))) / 2},
	// 1.3 × (2 − 0.4189783) = 2.0553283 W: margin −0.0553283 W, −0.0276641
	{check: 'cold_power_at_limit', kind: 'fail', name: 'steeper slope efficiency', inputs: {diode_slope_efficiency: '1.3 W/A'}, value: 1.3 * (2 - 0.45 * Math.exp(-10 / 140)), limit: 2, margin: 2 - 1.3 * (2 - 0.45 * Math.exp(-10 / 140)), fraction: (2 - 1.3 * (2 - 0.45 * Math.exp(-10 / 140))) / 2},
	// at the reference temperature exp(0) = 1: 1.25 W/A × (2 A − 0.4 A) = 2 W
	{check: 'cold_power_at_limit', kind: 'boundary', name: 'coldest case at the reference temperature', inputs: {diode_temperature_min: '25 degC', diode_threshold: '400 mA', diode_slope_efficiency: '1.25 W/A'}, value: 2, limit: 2, margin: 0, fraction: 0},

	// 3.65 V vs 1.9 V + 0.5 V = 2.4 V: margin 1.25 V, 1.25/2.4 = 0.5208333
	{check: 'compliance_headroom', kind: 'pass', name: 'demo supply', value: 3.65, limit: 2.4, margin: 1.25, fraction: 1.25 / 2.4},
	// 3 V × 0.95 − 1.1 V = 1.75 V vs 2.4 V: margin −0.65 V, −0.2708333
	{check: 'compliance_headroom', kind: 'fail', name: '3 V supply', inputs: {supply_nominal: '3 V'}, value: 1.75, limit: 2.4, margin: -0.65, fraction: -0.65 / 2.4},
	// 4.75 V − (0.3 V + 2.05 V) = 2.4 V
	{check: 'compliance_headroom', kind: 'boundary', name: 'dropout leaving exactly the headroom', inputs: {driver_dropout: '2.05 V'}, value: 2.4, limit: 2.4, margin: 0, fraction: 0},

	// 3.8 V vs 3.0 V: margin 0.8 V, 0.8/3 = 0.2666667
	{check: 'brownout_before_control_lost', kind: 'pass', name: 'demo trip', value: 3.8, limit: 3, margin: 0.8, fraction: 0.8 / 3},
	// 2.5 V vs 3.0 V: margin −0.5 V, −0.5/3 = −0.1666667
	{check: 'brownout_before_control_lost', kind: 'fail', name: 'trip below the regulation floor', inputs: {brownout_trip: '2.5 V'}, value: 2.5, limit: 3, margin: -0.5, fraction: -0.5 / 3},
	{check: 'brownout_before_control_lost', kind: 'boundary', name: 'trip at the regulation floor', inputs: {brownout_trip: '3 V'}, value: 3, limit: 3, margin: 0, fraction: 0},

	// 3.8 V vs 4.75 V: margin 0.95 V, 0.95/4.75 = 0.2
	{check: 'brownout_clear_of_service_supply', kind: 'pass', name: 'demo trip', value: 3.8, limit: 4.75, margin: 0.95, fraction: 0.2},
	// 4.9 V vs 4.75 V: margin −0.15 V, −0.15/4.75 = −0.0315789
	{check: 'brownout_clear_of_service_supply', kind: 'advise', name: 'trip above the low supply', inputs: {brownout_trip: '4.9 V'}, value: 4.9, limit: 4.75, margin: -0.15, fraction: -0.15 / 4.75},
	{check: 'brownout_clear_of_service_supply', kind: 'boundary', name: 'trip at the low supply', inputs: {brownout_trip: '4.75 V'}, value: 4.75, limit: 4.75, margin: 0, fraction: 0},

	// 6.7 W vs 9 W: margin 2.3 W, 2.3/9 = 0.2555556
	{check: 'dissipation_within_rating', kind: 'pass', name: 'demo, worst case at the limit', value: 6.7, limit: 9, margin: 2.3, fraction: 2.3 / 9},
	// R = 1 Ω: I* = (5.25 − 1.6)/(2 × 1) = 1.825 A < 2 A; (3.65 − 1.825) × 1.825 = 3.330625 W
	// (more than the 3.3 W at the limit); margin 5.669375 W, 0.6299306
	{check: 'dissipation_within_rating', kind: 'pass', name: 'worst case inside the range', inputs: {diode_series_resistance: '1 ohm'}, value: 3.330625, limit: 9, margin: 5.669375, fraction: 5.669375 / 9},
	// 12.6 V: I* = 11/0.3 > 2 A, so (12.6 − 1.6 − 0.3) × 2 = 21.4 W: margin −12.4 W, −1.3777778
	{check: 'dissipation_within_rating', kind: 'fail', name: '12 V supply', inputs: {supply_nominal: '12 V'}, value: 21.4, limit: 9, margin: -12.4, fraction: -12.4 / 9},
	// ambient at the rated ambient: no derating, 6.7 W allowed
	{check: 'dissipation_within_rating', kind: 'boundary', name: 'rating equal to the worst case', inputs: {ambient_max: '25 degC', driver_rated_dissipation: '6.7 W'}, value: 6.7, limit: 6.7, margin: 0, fraction: 0},

	// 5.25 V × 2 A = 10.5 W vs 9 W: margin −1.5 W, −1.5/9 = −0.1666667
	{check: 'short_circuit_dissipation', kind: 'advise', name: 'demo short circuit', value: 10.5, limit: 9, margin: -1.5, fraction: -1.5 / 9},
	// 5.25 V × 1.5 A = 7.875 W: margin 1.125 W, 1.125/9 = 0.125
	{check: 'short_circuit_dissipation', kind: 'pass', name: 'lower limit', inputs: {current_limit: '1.5 A'}, value: 7.875, limit: 9, margin: 1.125, fraction: 0.125},
	{check: 'short_circuit_dissipation', kind: 'boundary', name: 'rating equal to the short-circuit power', inputs: {ambient_max: '25 degC', driver_rated_dissipation: '10.5 W'}, value: 10.5, limit: 10.5, margin: 0, fraction: 0},

	// 5 s vs 3 s: margin 2 s, 2/3
	{check: 'emission_delay_long_enough', kind: 'pass', name: 'longer delay', inputs: {emission_delay: '5 s'}, value: 5, limit: 3, margin: 2, fraction: 2 / 3},
	// 2 s vs 3 s: margin −1 s, −1/3
	{check: 'emission_delay_long_enough', kind: 'fail', name: 'short delay', inputs: {emission_delay: '2 s'}, value: 2, limit: 3, margin: -1, fraction: -1 / 3},
	{check: 'emission_delay_long_enough', kind: 'boundary', name: 'demo delay equal to the minimum', value: 3, limit: 3, margin: 0, fraction: 0},

	// 50 ms vs 10 ms: margin 40 ms, 40/10 = 4
	{check: 'soft_start_long_enough', kind: 'pass', name: 'demo ramp', value: 0.05, limit: 0.01, margin: 0.04, fraction: 4},
	// 5 ms vs 10 ms: margin −5 ms, −0.5
	{check: 'soft_start_long_enough', kind: 'fail', name: 'fast ramp', inputs: {soft_start_time: '5 ms'}, value: 0.005, limit: 0.01, margin: -0.005, fraction: -0.5},
	{check: 'soft_start_long_enough', kind: 'boundary', name: 'ramp equal to the minimum', inputs: {soft_start_time: '10 ms'}, value: 0.01, limit: 0.01, margin: 0, fraction: 0},

	// 5 V vs 15 V: margin 10 V, 10/15 = 0.6666667
	{check: 'photodiode_bias_within_rating', kind: 'pass', name: 'demo bias', value: 5, limit: 15, margin: 10, fraction: 10 / 15},
	// 20 V vs 15 V: margin −5 V, −1/3
	{check: 'photodiode_bias_within_rating', kind: 'fail', name: 'bias above the rating', inputs: {photodiode_bias: '20 V'}, value: 20, limit: 15, margin: -5, fraction: -5 / 15},
	{check: 'photodiode_bias_within_rating', kind: 'boundary', name: 'bias equal to the rating', inputs: {photodiode_bias: '15 V'}, value: 15, limit: 15, margin: 0, fraction: 0},

	// The typed beam 1 power against what the setup can emit at the limit, coldest (power_at_limit_cold).
	// 2 W vs 1.7391239 W: margin 0.2608761 W, 0.2608761/1.7391239 = 0.1500043
	{check: 'beam1_power_covers_worst_case', kind: 'pass', name: 'demo 2 W typed', value: 2, limit: 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), margin: 2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), fraction: (2 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140))) / (1.1 * (2 - 0.45 * Math.exp(-10 / 140)))},
	// 1 W vs 1.7391239 W: margin −0.7391239 W, −0.4249978
	{check: 'beam1_power_covers_worst_case', kind: 'advise', name: '1 W typed', inputs: {beam1_power: '1 W'}, value: 1, limit: 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), margin: 1 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140)), fraction: (1 - 1.1 * (2 - 0.45 * Math.exp(-10 / 140))) / (1.1 * (2 - 0.45 * Math.exp(-10 / 140)))},
	// at the reference temperature: 1.25 W/A × (2 A − 0.4 A) = 2 W, the typed power
	{check: 'beam1_power_covers_worst_case', kind: 'boundary', name: 'worst case equal to the typed power', inputs: {diode_temperature_min: '25 degC', diode_threshold: '400 mA', diode_slope_efficiency: '1.25 W/A'}, value: 2, limit: 2, margin: 0, fraction: 0},

	// People around the bench. Limiting aperture 7 mm: A = π × 3.5² mm² = 3.848451e-5 m².
	// Beam 1, 808 nm, invisible so 10 s: MPE = 10·C_A = 10 × 10^(0.002 × 108) = 16.443717 W/m²;
	// E₀ = 2 W / A = 51 968.9 W/m²; OD = log10(E₀/MPE) = 3.499744.
	{check: 'beam1_eyewear_sufficient', kind: 'pass', name: 'OD 5 eyewear', value: 5, limit: 3.499744034, margin: 1.500255966, fraction: 1.500255966 / 3.499744034},
	{check: 'beam1_eyewear_sufficient', kind: 'fail', name: 'OD 3 eyewear', inputs: {beam1_eyewear_od: '3'}, value: 3, limit: 3.499744034, margin: -0.499744034, fraction: -0.499744034 / 3.499744034},
	{check: 'beam1_eyewear_sufficient', kind: 'boundary', name: 'eyewear exactly at the required OD', inputs: {beam1_eyewear_od: '3.499744034269296'}, value: 3.499744034, limit: 3.499744034, margin: 0, fraction: 0},
	// NOHD = (√(4 × 2 W/(π × 16.443717 W/m²)) − 3 mm)/0.15 rad = (0.393524 − 0.003)/0.15 = 2.603486 m
	{check: 'beam1_hazard_distance', kind: 'pass', name: 'uncontrolled position 4 m away', value: 2.603486285, limit: 4, margin: 1.396513715, fraction: 1.396513715 / 4},
	{check: 'beam1_hazard_distance', kind: 'advise', name: 'uncontrolled position 2 m away', inputs: {uncontrolled_distance: '2 m'}, value: 2.603486285, limit: 2, margin: -0.603486285, fraction: -0.603486285 / 2},
	{check: 'beam1_hazard_distance', kind: 'boundary', name: 'uncontrolled position at the NOHD', inputs: {uncontrolled_distance: '2.603486284682414 m'}, value: 2.603486285, limit: 2.603486285, margin: 0, fraction: 0},
	// Beam 2, 650 nm aiming beam, visible so 0.25 s: MPE = 18 × 0.25^0.75 / 0.25 = 25.455844 W/m²;
	// E₀ = 1 mW / A = 25.984481 W/m²; OD = log10(1.020768) = 0.0089265.
	{check: 'beam2_eyewear_sufficient', kind: 'pass', name: 'OD 0.5 at the aiming wavelength', value: 0.5, limit: 0.00892653567, margin: 0.49107346433, fraction: 0.49107346433 / 0.00892653567},
	// 10 mW: OD = log10(10.20768) = 1.0089265
	{check: 'beam2_eyewear_sufficient', kind: 'fail', name: 'a 10 mW aiming beam', inputs: {beam2_power: '10 mW'}, value: 0.5, limit: 1.00892653567, margin: -0.50892653567, fraction: -0.50892653567 / 1.00892653567},
	{check: 'beam2_eyewear_sufficient', kind: 'boundary', name: 'eyewear exactly at the required OD', inputs: {beam2_eyewear_od: '0.008926535670018101'}, value: 0.00892653567, limit: 0.00892653567, margin: 0, fraction: 0},
	// The demo gives 1 mrad at the 1/e² points: φ = 1 mrad/√2 = 0.7071068 mrad at 1/e (Gaussian beam).
	// NOHD = (√(4 × 1 mW/(π × 25.455844)) − 2 mm)/0.7071068 mrad = (7.072310 − 2) mm / 0.7071068 mrad = 7.173330 m
	{check: 'beam2_hazard_distance', kind: 'advise', name: 'the aiming beam reaches past 4 m', value: 7.17333003, limit: 4, margin: -3.17333003, fraction: -3.17333003 / 4},
	{check: 'beam2_hazard_distance', kind: 'pass', name: 'uncontrolled position 8 m away', inputs: {uncontrolled_distance: '8 m'}, value: 7.17333003, limit: 8, margin: 0.826669967, fraction: 0.826669967 / 8},
	{check: 'beam2_hazard_distance', kind: 'boundary', name: 'uncontrolled position at the NOHD', inputs: {uncontrolled_distance: '7.17333003285759 m'}, value: 7.17333003, limit: 7.17333003, margin: 0, fraction: 0},
	// Beam 3, 1064 nm, 10 s: MPE = 10·C_A = 50 W/m²; E₀ = 0.5 W / A = 12 992.2 W/m²; OD = 2.414714
	{check: 'beam3_eyewear_sufficient', kind: 'pass', name: 'OD 4 at 1064 nm', base: 'three', value: 4, limit: 2.414714039, margin: 1.585285961, fraction: 1.585285961 / 2.414714039},
	{check: 'beam3_eyewear_sufficient', kind: 'fail', name: 'OD 2 at 1064 nm', base: 'three', inputs: {beam3_eyewear_od: '2'}, value: 2, limit: 2.414714039, margin: -0.414714039, fraction: -0.414714039 / 2.414714039},
	{check: 'beam3_eyewear_sufficient', kind: 'boundary', name: 'eyewear exactly at the required OD', base: 'three', inputs: {beam3_eyewear_od: '2.414714038605315'}, value: 2.414714039, limit: 2.414714039, margin: 0, fraction: 0},
	// NOHD = √(4 × 0.5/(π × 50))/0.01 rad = 0.112838 m / 0.01 = 11.283792 m
	{check: 'beam3_hazard_distance', kind: 'advise', name: 'the pump leak reaches past 4 m', base: 'three', value: 11.28379167, limit: 4, margin: -7.28379167, fraction: -7.28379167 / 4},
	{check: 'beam3_hazard_distance', kind: 'pass', name: 'uncontrolled position 20 m away', base: 'three', inputs: {uncontrolled_distance: '20 m'}, value: 11.28379167, limit: 20, margin: 8.71620833, fraction: 8.71620833 / 20},
	{check: 'beam3_hazard_distance', kind: 'boundary', name: 'uncontrolled position at the NOHD', base: 'three', inputs: {uncontrolled_distance: '11.283791670955125 m'}, value: 11.28379167, limit: 11.28379167, margin: 0, fraction: 0},
	// 2 W at 808 nm is above the 0.5 W Class 3B limit: rank 5 (Class 4), the label's rank
	{check: 'label_class_covers_output', kind: 'boundary', name: 'Class 4 label on a 2 W beam', value: 5, limit: 5, margin: 0, fraction: 0},
	// 0.4 W: above 5 × 3.9e-4 × 1.644372 W = 3.2 mW (3R) and at most 0.5 W: rank 4 (Class 3B). A 0.5 A
	// limit keeps the worst case below it: 1.1 W/A × (0.5 A − 0.4189783 A) = 0.0891 W.
	{check: 'label_class_covers_output', kind: 'pass', name: '0.4 W under a Class 4 label', inputs: {beam1_power: '0.4 W', current_limit: '0.5 A', current_setpoint: '0.4 A', modulation_source_peak: '0.5 V'}, value: 4, limit: 5, margin: 1, fraction: 0.2},
	{check: 'label_class_covers_output', kind: 'advise', name: 'Class 3B label on a 2 W beam', inputs: {laser_class: 'class_3b'}, value: 5, limit: 4, margin: -1, fraction: -0.25},

	// Inputs that contradict each other (advice naming both numbers). beam_power_tolerance 10 %:
	// 2 W beam vs 2 W × 1.1 = 2.2 W; margin 0.2 W, 0.2/2.2
	{check: 'beam1_power_within_diode_maximum', kind: 'pass', name: 'demo beam at the diode maximum', value: 2, limit: 2.2, margin: 0.2, fraction: 0.2 / 2.2},
	// 3 W vs 2.2 W: margin −0.8 W, −0.8/2.2
	{check: 'beam1_power_within_diode_maximum', kind: 'advise', name: 'a 3 W beam from a 2 W diode', inputs: {beam1_power: '3 W'}, value: 3, limit: 2.2, margin: -0.8, fraction: -0.8 / 2.2},
	{check: 'beam1_power_within_diode_maximum', kind: 'boundary', name: 'beam exactly 10 % above the diode maximum', inputs: {beam1_power: '2200 mW'}, value: 2.2, limit: 2.2, margin: 0, fraction: 0},
	// h·c/(q·λ) with CODATA 2018 exact h, c, q: 1.2398419843320026e-6 V·m / 808 nm = 1.5344579014 W/A;
	// 1.1 W/A: margin 0.4344579014 W/A, fraction 0.2831344548
	{check: 'slope_efficiency_within_photon_limit', kind: 'pass', name: 'demo 1.1 W/A at 808 nm', value: 1.1, limit: 1.5344579014009934, margin: 0.4344579014009933, fraction: 0.283134454848402},
	// 1.6 W/A at 808 nm: margin −0.0655420986 W/A, fraction −0.0427135202
	{check: 'slope_efficiency_within_photon_limit', kind: 'advise', name: '1.6 W/A at 808 nm', inputs: {diode_slope_efficiency: '1.6 W/A'}, value: 1.6, limit: 1.5344579014009934, margin: -0.06554209859900673, fraction: -0.042713520220506125},
	// 1.1 W/A is possible at 808 nm but not at 1550 nm: 1.2398419843320026e-6/1550e-9 = 0.7998980544 W/A
	{check: 'slope_efficiency_within_photon_limit', kind: 'advise', name: '1.1 W/A at 1550 nm', inputs: {beam1_wavelength: '1550 nm'}, value: 1.1, limit: 0.7998980544077436, margin: -0.3001019455922564, fraction: -0.3001019455922564 / 0.7998980544077436},
	{check: 'slope_efficiency_within_photon_limit', kind: 'boundary', name: 'slope exactly at the photon limit', inputs: {diode_slope_efficiency: '1.5344579014009934 W/A'}, value: 1.5344579014009934, limit: 1.5344579014009934, margin: 0, fraction: 0},
	// 0.45 A threshold vs the 2 A limit: margin 1.55 A, 1.55/2 = 0.775
	{check: 'threshold_below_limit', kind: 'pass', name: 'demo threshold', value: 0.45, limit: 2, margin: 1.55, fraction: 0.775},
	// 2.5 A vs 2 A: margin −0.5 A, −0.25
	{check: 'threshold_below_limit', kind: 'advise', name: 'threshold above the limit', inputs: {diode_threshold: '2.5 A'}, value: 2.5, limit: 2, margin: -0.5, fraction: -0.25},
	{check: 'threshold_below_limit', kind: 'boundary', name: 'threshold equal to the limit', inputs: {diode_threshold: '2000 mA'}, value: 2, limit: 2, margin: 0, fraction: 0},
];

// Checks that are a true/false condition: no value, limit or margin.
const conditions: Condition[] = [
	// 2 A ≤ 2.5 A and 1.7391 W ≤ 2 W
	{check: 'monitor_loss_contained', kind: 'pass', name: 'limit and cold power within ratings', base: 'power'},
	{check: 'monitor_loss_contained', kind: 'fail', name: 'limit above the absolute maximum', base: 'power', inputs: {current_limit: '2.6 A'}},
	// 1.7391 W > 1.7 W (the setpoint 1.5 W is still below 1.7 W × 0.9 = 1.53 W)
	{check: 'monitor_loss_contained', kind: 'fail', name: 'cold power at the limit above the maximum power', base: 'power', inputs: {diode_max_power: '1.7 W'}},
	// limit = absolute maximum 2.5 A; 0.5 W/A × (2.5 − 0.4189783) A = 1.0405 W ≤ 2 W
	{check: 'monitor_loss_contained', kind: 'boundary', name: 'limit equal to the absolute maximum', base: 'power', inputs: {current_limit: '2.5 A', diode_slope_efficiency: '0.5 W/A'}},

	{check: 'reverse_protection_fitted', kind: 'pass', name: 'protection fitted', inputs: {reverse_protection: 'yes'}},
	{check: 'reverse_protection_fitted', kind: 'fail', name: 'no protection', inputs: {reverse_protection: 'no'}},

	{check: 'pin_configuration_supported', kind: 'pass', name: 'common cathode on the ground side'},
	{check: 'pin_configuration_supported', kind: 'pass', name: 'common anode on the supply side', inputs: {pin_configuration: 'common_anode', mounting: 'supply_side'}},
	{check: 'pin_configuration_supported', kind: 'fail', name: 'common anode on the ground side', inputs: {pin_configuration: 'common_anode'}},
	{check: 'pin_configuration_supported', kind: 'fail', name: 'common cathode on the supply side', inputs: {mounting: 'supply_side'}},
	// a floating package is the one row both mountings list
	{check: 'pin_configuration_supported', kind: 'boundary', name: 'floating on the ground side', inputs: {pin_configuration: 'floating'}},
	{check: 'pin_configuration_supported', kind: 'boundary', name: 'floating on the supply side', inputs: {pin_configuration: 'floating', mounting: 'supply_side'}},
];

/** Checks with no boundary to test, and why. */
const withoutBoundary: Record<string, string> = {reverse_protection_fitted: 'a yes/no input has no boundary'};

// An input each check needs is left out: the check is open and names it.
const opens: Array<{check: string; base?: Base; remove: string[]; needs: string[]}> = [
	{check: 'beam1_power_within_diode_maximum', remove: ['diode_max_power'], needs: ['diode_max_power']},
	{check: 'slope_efficiency_within_photon_limit', remove: ['beam1_wavelength'], needs: ['beam1_wavelength']},
	{check: 'threshold_below_limit', remove: ['diode_threshold'], needs: ['diode_threshold']},
	{check: 'limit_below_diode_maximum', remove: ['diode_max_current'], needs: ['diode_max_current']},
	{check: 'limit_within_driver', remove: ['driver_max_current'], needs: ['driver_max_current']},
	{check: 'setpoint_below_limit', remove: ['current_setpoint'], needs: ['current_setpoint']},
	{check: 'setpoint_below_limit', remove: ['control_mode'], needs: ['control_mode']},
	{check: 'setpoint_plus_modulation_below_limit', remove: ['modulation_gain'], needs: ['modulation_gain']},
	{check: 'power_setpoint_below_maximum', base: 'power', remove: ['diode_max_power'], needs: ['diode_max_power']},
	{check: 'monitor_current_within_input', base: 'power', remove: ['photodiode_responsivity'], needs: ['photodiode_responsivity']},
	{check: 'monitor_loss_contained', base: 'power', remove: ['diode_slope_efficiency'], needs: ['diode_slope_efficiency']},
	{check: 'cold_power_at_limit', remove: ['diode_t0'], needs: ['diode_t0']},
	{check: 'compliance_headroom', remove: ['cable_resistance'], needs: ['cable_resistance']},
	{check: 'brownout_before_control_lost', remove: ['brownout_trip'], needs: ['brownout_trip']},
	{check: 'brownout_clear_of_service_supply', remove: ['supply_nominal'], needs: ['supply_nominal']},
	{check: 'dissipation_within_rating', remove: ['diode_series_resistance'], needs: ['diode_series_resistance']},
	{check: 'dissipation_within_rating', remove: ['driver_rated_dissipation', 'ambient_max'], needs: ['ambient_max', 'driver_rated_dissipation']},
	{check: 'short_circuit_dissipation', remove: ['supply_nominal'], needs: ['supply_nominal']},
	{check: 'emission_delay_long_enough', remove: ['emission_delay'], needs: ['emission_delay']},
	{check: 'soft_start_long_enough', remove: ['soft_start_time'], needs: ['soft_start_time']},
	{check: 'photodiode_bias_within_rating', remove: ['photodiode_reverse_max'], needs: ['photodiode_reverse_max']},
	{check: 'reverse_protection_fitted', remove: ['reverse_protection'], needs: ['reverse_protection']},
	{check: 'pin_configuration_supported', remove: ['pin_configuration'], needs: ['pin_configuration']},
	{check: 'beam1_power_covers_worst_case', remove: ['beam1_power'], needs: ['beam1_power']},
	{check: 'beam1_power_covers_worst_case', remove: ['diode_threshold'], needs: ['diode_threshold']},
	{check: 'beam1_eyewear_sufficient', remove: ['beam1_eyewear_od'], needs: ['beam1_eyewear_od']},
	{check: 'beam1_eyewear_sufficient', remove: ['beam1_eye_diameter'], needs: ['beam1_eye_diameter']},
	{check: 'beam1_eyewear_sufficient', remove: ['diode_slope_efficiency'], needs: ['diode_slope_efficiency']},
	{check: 'beam1_hazard_distance', remove: ['beam1_divergence_convention'], needs: ['beam1_divergence_convention']},
	{check: 'beam1_hazard_distance', remove: ['uncontrolled_distance'], needs: ['uncontrolled_distance']},
	{check: 'beam2_eyewear_sufficient', remove: ['beam2_eyewear_od'], needs: ['beam2_eyewear_od']},
	{check: 'beam2_hazard_distance', remove: ['beam2_divergence'], needs: ['beam2_divergence']},
	{check: 'beam2_hazard_distance', remove: ['beam2_divergence_convention'], needs: ['beam2_divergence_convention']},
	{check: 'beam2_eyewear_sufficient', remove: ['beam2_eye_diameter'], needs: ['beam2_eye_diameter']},
	{check: 'beam3_eyewear_sufficient', base: 'three', remove: ['beam3_power'], needs: ['beam3_power']},
	{check: 'beam3_hazard_distance', base: 'three', remove: ['beam3_divergence'], needs: ['beam3_divergence']},
	{check: 'label_class_covers_output', remove: ['beam1_power'], needs: ['beam1_power']},
];

// A check whose `when` is false is skipped: constant-current checks in constant-power mode and back.
const skips: Array<{check: string; base: Base}> = [
	{check: 'setpoint_below_limit', base: 'power'},
	{check: 'setpoint_plus_modulation_below_limit', base: 'power'},
	{check: 'power_setpoint_below_maximum', base: 'current'},
	{check: 'monitor_current_within_input', base: 'current'},
	{check: 'monitor_loss_contained', base: 'current'},
	{check: 'beam2_eyewear_sufficient', base: 'single'},
	{check: 'beam2_hazard_distance', base: 'single'},
	{check: 'beam3_eyewear_sufficient', base: 'current'},
	{check: 'beam3_hazard_distance', base: 'current'},
	{check: 'beam3_eyewear_sufficient', base: 'single'},
	{check: 'emission_delay_long_enough', base: 'class2'},
];

const removing = (names: string[]): Changes => Object.fromEntries(names.map((name) => [name, null]));
const expectedVerdict = (kind: Kind): Verdict => (kind === 'boundary' ? 'pass' : kind);

describe('the shipped policy, check by check', () => {
	it.each(comparisons)('$check: $name ($kind)', ({check, kind, base, inputs, value, limit, margin, fraction}) => {
		const evaluation = evaluateDocument(rules, withChanges(bases[base ?? 'current'], inputs));
		const result = checkResult(evaluation, check);
		expect(result.verdict).toBe(expectedVerdict(kind));
		expectClose(result.value?.si, value, 'value');
		expectClose(result.limit?.si, limit, 'limit');
		expectClose(result.margin?.si, margin, 'margin');
		expectClose(result.margin?.fraction, fraction, 'margin fraction');
		if (kind === 'fail') expect(evaluation.outcome).toBe('do_not_energize');
	});

	it.each(conditions)('$check: $name ($kind)', ({check, kind, base, inputs}) => {
		const evaluation = evaluateDocument(rules, withChanges(bases[base ?? 'current'], inputs));
		const result = checkResult(evaluation, check);
		expect(result.verdict).toBe(expectedVerdict(kind));
		expect(result.value).toBeUndefined();
		expect(result.margin).toBeUndefined();
		if (kind === 'fail') expect(evaluation.outcome).toBe('do_not_energize');
	});

	it.each(opens)('$check is open without $remove', ({check, base, remove, needs}) => {
		const evaluation = evaluateDocument(rules, withChanges(bases[base ?? 'current'], removing(remove)));
		const result = checkResult(evaluation, check);
		expect(result.verdict).toBe('open');
		expect([...(result.needs ?? [])].sort()).toEqual(needs);
		expect(result.value).toBeUndefined();
		expect(evaluation.outcome).toBe('incomplete');
	});

	it.each(skips)('$check is skipped when its condition is false', ({check, base}) => {
		const evaluation = evaluateDocument(rules, bases[base]);
		const result = checkResult(evaluation, check);
		expect(result.verdict).toBe('skip');
		expect(result.value).toBeUndefined();
		expect(result.needs).toBeUndefined();
	});

	it('fills every placeholder of a message when a check does not hold', () => {
		const notHolding = [...comparisons, ...conditions].filter(({kind}) => kind === 'fail' || kind === 'advise');
		for (const {check, base, inputs} of notHolding) {
			const result = checkResult(evaluateDocument(rules, withChanges(bases[base ?? 'current'], inputs)), check);
			if (result.message !== undefined) expect(result.message, check).not.toMatch(/\{\{|\}\}/);
		}
	});

	it('shows the ceiling and margin in the message of the current-limit check', () => {
		// 2.4 A against 2.5 A × 0.9 = 2.25 A
		const result = checkResult(evaluateDocument(rules, withChanges(clear, {current_limit: '2.4 A'})), 'limit_below_diode_maximum');
		expect(result.message).toContain('2.4');
		expect(result.message).toContain('2.25');
		expect(result.message).toContain('2.5');
	});

	it('has a pass, a fail or advise, a boundary, an open case and (with a when) a skip case for every check', () => {
		const cases = [...comparisons, ...conditions];
		for (const {id, when} of rules.rules.checks) {
			const kinds = new Set(cases.filter(({check}) => check === id).map(({kind}) => kind));
			expect(kinds.has('pass'), `${id}: pass`).toBe(true);
			expect(kinds.has('fail') || kinds.has('advise'), `${id}: fail or advise`).toBe(true);
			expect(kinds.has('boundary') || id in withoutBoundary, `${id}: boundary`).toBe(true);
			expect(opens.some(({check}) => check === id), `${id}: open`).toBe(true);
			if (when) expect(skips.some(({check}) => check === id), `${id}: skip`).toBe(true);
		}
		const known = new Set(rules.rules.checks.map(({id}) => id));
		for (const {check} of [...cases, ...opens, ...skips]) expect(known.has(check), `unknown check ${check}`).toBe(true);
	});

	it('marks an advisory check that does not hold as advise, never fail', () => {
		const advisory = rules.rules.checks.filter(({severity}) => severity === 'advise').map(({id}) => id);
		expect(advisory.sort()).toEqual([
			'beam1_hazard_distance',
			'beam1_power_covers_worst_case',
			'beam1_power_within_diode_maximum',
			'beam2_hazard_distance',
			'beam3_hazard_distance',
			'brownout_clear_of_service_supply',
			'label_class_covers_output',
			'short_circuit_dissipation',
			'slope_efficiency_within_photon_limit',
			'threshold_below_limit',
		]);
		for (const id of advisory) expect(comparisons.some(({check, kind}) => check === id && kind === 'advise'), id).toBe(true);
	});
});

describe('the shipped policy, outcome', () => {
	const outcomes: Array<{name: string; base?: Base; inputs?: Changes; confirmations?: Changes; outcome: Outcome}> = [
		{name: 'the clearing demo, whose short-circuit check only advises', outcome: 'clear_to_energize'},
		{name: 'the constant-power bench with a measured responsivity', base: 'power', outcome: 'clear_to_energize'},
		{name: 'a stop check fails', inputs: {current_limit: '2.4 A'}, outcome: 'do_not_energize'},
		{name: 'an advisory check does not hold', inputs: {brownout_trip: '4.9 V'}, outcome: 'clear_to_energize'},
		{name: 'a confirmation answered no', confirmations: {use_authorised: 'no'}, outcome: 'do_not_energize'},
		{name: 'a confirmation unanswered', confirmations: {interlock_loop_tested: null}, outcome: 'incomplete'},
		{name: 'a required input missing that no check uses', inputs: {diode_serial: null}, outcome: 'incomplete'},
		{name: 'a stop check open', inputs: {emission_delay: null}, outcome: 'incomplete'},
		{name: 'a fail outweighs an open check', inputs: {current_limit: '2.4 A', brownout_trip: null}, outcome: 'do_not_energize'},
		{name: 'a no outweighs an unanswered confirmation', confirmations: {use_authorised: 'no', interlock_loop_tested: null}, outcome: 'do_not_energize'},
		{name: 'the responsivity not confirmed as measured in constant power', base: 'power', confirmations: {responsivity_measured: null}, outcome: 'incomplete'},
		{name: 'key control skipped below class 3B', inputs: {laser_class: 'class_2'}, confirmations: {key_control: null}, outcome: 'clear_to_energize'},
		{name: 'key control open while the class is unknown', inputs: {laser_class: null}, outcome: 'incomplete'},
	];

	it.each(outcomes)('$name: $outcome', ({base, inputs, confirmations, outcome}) => {
		expect(evaluateDocument(rules, withChanges(bases[base ?? 'current'], inputs, confirmations)).outcome).toBe(outcome);
	});

	it('keeps a not-applicable answer and its note, and still clears', () => {
		const evaluation = evaluateDocument(rules, clear);
		const bypass = evaluation.confirmations.find(({id}) => id === 'bypass_recorded');
		expect(bypass).toMatchObject({status: 'not_applicable', note: 'No bypass is fitted on bench 3.'});
		expect(evaluation.outcome).toBe('clear_to_energize');
	});

	it('lists an asked but unanswered input as missing, and no check as open for it', () => {
		const evaluation = evaluateDocument(rules, withChanges(clear, {diode_serial: null}));
		expect(evaluation.missingInputs).toEqual(['diode_serial']);
		expect(evaluation.checks.filter(({verdict}) => verdict === 'open')).toEqual([]);
	});

	it('does not ask for inputs whose condition is false', () => {
		// constant power: current_setpoint, modulation_gain and modulation_source_peak are not asked
		expect(evaluateDocument(rules, constantPower).missingInputs).toEqual([]);
	});

	it('marks a confirmation skipped when its condition is false and open when its input is missing', () => {
		const skipped = evaluateDocument(rules, withChanges(clear, {laser_class: 'class_3r'}, {key_control: null}));
		expect(skipped.confirmations.find(({id}) => id === 'key_control')?.status).toBe('skip');
		const open = evaluateDocument(rules, withChanges(clear, {laser_class: null}));
		expect(open.confirmations.find(({id}) => id === 'key_control')).toMatchObject({status: 'open', needs: ['laser_class']});
		expect(evaluateDocument(rules, clear).confirmations.find(({id}) => id === 'responsivity_measured')?.status).toBe('skip');
	});

	const refused: Array<{name: string; confirmations: Changes; code: string}> = [
		{name: 'not applicable without a note', confirmations: {bypass_recorded: 'not applicable'}, code: 'answers-note-required'},
		{name: 'not applicable where the rules forbid it', confirmations: {interlock_loop_tested: {answer: 'not applicable', note: 'no loop on this bench'}}, code: 'answers-not-applicable-forbidden'},
		{name: 'an answer that is not yes, no or not applicable', confirmations: {leads_shorted: 'maybe'}, code: 'answers-bad-answer'},
	];

	it.each(refused)('refuses $name', ({confirmations, code}) => {
		const answers = readAnswers(rules, withChanges(clear, {}, confirmations));
		expect(answers.ok).toBe(false);
		if (!answers.ok) expect(answers.errors.map((found) => found.code)).toEqual([code]);
	});
});
