import type {CompiledRules} from '../rules/compile/compiled-rules.js';
import type {Purpose} from '../records/signature-purpose.js';

/** What the site's rule file asks of signatures (its `signing:` section), with the defaults filled in. */
export type SigningPolicy = {
	/** Roles that carry authority: they count only when the auditor's trust list grants them. */
	authorityRoles: string[];
	/** A countersignature by a key granted one of these roles is required … */
	countersignRoles: string[];
	/** … for a bench check of one of these laser classes (options of laser_class) … */
	countersignClasses: string[];
	/** … and for any bench check made under rules with a switched-off check. */
	countersignSwitchedOff: boolean;
	/** An interlock functional test needs a witness signature by a trusted key. */
	signedWitnessForInterlockTests: boolean;
	/** The purposes each kind of record needs among its signatures. */
	purposes: {benchCheck: Purpose[]; interlockTest: Purpose[]};
};

/** The roles that carry authority when the rule file names none: common practice for a laser lab. */
export const defaultAuthorityRoles = ['laser safety officer', 'supervisor'];

/** The signing policy of the current rules; without a `signing:` section, authority roles default and nothing more is required. */
export function signingPolicy(current: CompiledRules): SigningPolicy {
	const stated = current.rules.signing;
	return {
		authorityRoles: stated?.authority_roles ?? defaultAuthorityRoles,
		countersignRoles: stated?.countersign?.roles ?? [],
		countersignClasses: stated?.countersign?.laser_classes ?? [],
		countersignSwitchedOff: stated?.countersign?.switched_off_checks ?? false,
		signedWitnessForInterlockTests: stated?.signed_witness_for_interlock_tests ?? false,
		purposes: {benchCheck: stated?.purposes?.bench_check ?? ['operator'], interlockTest: stated?.purposes?.interlock_test ?? ['operator']},
	};
}

const fold = (text: string) => text.trim().replace(/\s+/g, ' ').toLowerCase();

/** Whether a stated role is one that carries authority (compared case-insensitively after trimming). */
export function isAuthorityRole(role: string, authorityRoles: readonly string[] = defaultAuthorityRoles): boolean {
	const stated = fold(role);
	return stated !== '' && authorityRoles.some((entry) => fold(entry) === stated);
}

/**
 * Whether a signature made at `signedAt` falls on or after a revocation `from` (a date, or a
 * time with its offset). A bare date is taken from the earliest instant it is that date
 * anywhere (00:00 at UTC+14), the protective reading.
 */
export function revokedAt(signedAt: string, from: string): boolean {
	const start = /^\d{4}-\d{2}-\d{2}$/.test(from) ? Date.parse(`${from}T00:00:00+14:00`) : Date.parse(from);
	const at = Date.parse(signedAt);
	// An unreadable date cannot show the signature came before the revocation: take it as after.
	return Number.isNaN(start) || Number.isNaN(at) || at >= start;
}
