import {finding, type Finding} from '../records/findings.js';
import {inputEntry, type AnyBody} from '../records/record-schema.js';
import type {Purpose} from '../records/signature-purpose.js';
import type {SignatureReport} from './audit-trust.js';
import {sameRole} from './audit-trust.js';
import type {SigningPolicy} from './signing-policy.js';

/** What the audit knows of a bench check's rules besides its body: how many checks they switched off. */
export type SigningContext = {switchedOff: number};

/**
 * What the site's signing policy and the record's own statements ask of its signatures:
 * a witness named in an interlock test must have signed (purpose witness, by a trusted key);
 * the purposes the policy requires for the record's kind; a signed witness for interlock
 * tests when the policy asks; a countersignature by a granted role for the laser classes
 * and switched-off checks the policy names.
 */
export function signingFindings(body: AnyBody, signatures: readonly SignatureReport[], policy: SigningPolicy, context: SigningContext = {switchedOff: 0}): Finding[] {
	const findings: Finding[] = [];
	const authentic = signatures.filter((signature) => signature.authentic);
	const has = (purpose: Purpose) => authentic.some((signature) => signature.purpose === purpose);
	if (body.kind === 'interlock-test' && body.witness && !signatures.some((signature) => signature.valid && signature.purpose === 'witness')) {
		findings.push(finding('trust', 'audit-witness-not-signed', {name: body.witness.name}));
	}
	const required = body.kind === 'interlock-test' ? policy.purposes.interlockTest : policy.purposes.benchCheck;
	// Whether the keys are trusted is the trust findings' part: here only what the signatures state counts.
	const lacking = required.filter((purpose) => !signatures.some((signature) => signature.valid && signature.purpose === purpose));
	if (lacking.length > 0) findings.push(finding('policy', 'audit-purpose-required', {purposes: lacking.join(', '), kind: body.kind}));
	if (body.kind === 'interlock-test' && policy.signedWitnessForInterlockTests && !has('witness')) findings.push(finding('policy', 'audit-witness-signature-required'));
	if (body.kind === 'bench-check' && policy.countersignRoles.length > 0) {
		const laserClassInput = inputEntry(body.inputs['laser_class']);
		const laserClass = laserClassInput?.option ?? laserClassInput?.entered;
		const reasons: string[] = [];
		if (laserClass !== undefined && policy.countersignClasses.includes(laserClass)) reasons.push(`laser class ${laserClass}`);
		if (policy.countersignSwitchedOff && context.switchedOff > 0) reasons.push(`a check switched off in its rules (${context.switchedOff})`);
		if (reasons.length > 0 && !isCountersigned(signatures, policy)) findings.push(finding('policy', 'audit-countersign-required', {roles: policy.countersignRoles.join(' or '), why: reasons.join(' and ')}));
	}
	return findings;
}

/** Whether a record carries a countersignature the policy accepts: an authentic signature other than the operator's, by a key the trust list grants one of the countersigning roles. */
export function isCountersigned(signatures: readonly SignatureReport[], policy: SigningPolicy): boolean {
	return policy.countersignRoles.length > 0 && signatures.some((signature) => signature.authentic && signature.purpose !== 'operator' && (signature.granted ?? []).some((role) => policy.countersignRoles.some((wanted) => sameRole(role, wanted))));
}
