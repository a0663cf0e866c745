import type {SignatureCheck} from '../records/integrity.js';
import {finding, type Finding} from '../records/findings.js';
import type {TrustedKey} from '../records/key-files.js';
import type {AnyRecord, Signature} from '../records/record-schema.js';

/** The keys an auditor trusts: their own and the colleagues' they have added. */
export type Trust = {own?: string | undefined; trusted: readonly TrustedKey[]};

/** One signature as the audit reports it: who, as what, when, with which key, and whether that key is trusted. */
export type SignatureReport = {
	index: number;
	signer: Signature['signer'];
	meaning: Signature['meaning'];
	signedAt: string;
	fingerprint: string;
	valid: boolean;
	/** `own`: the auditor's own key; `trusted`: in their list (as `trustedAs`); `untrusted`: neither. */
	trust: 'own' | 'trusted' | 'untrusted';
	trustedAs?: string;
};

/**
 * Names each signer with their role, meaning and key, and whether the key is trusted. A valid
 * signature with an untrusted key is a finding: the record is intact, but who made it is unproven.
 */
export function signatureReports(record: AnyRecord, checks: readonly SignatureCheck[] | undefined, trust: Trust): {signatures: SignatureReport[]; findings: Finding[]} {
	const byFingerprint = new Map(trust.trusted.map((key) => [key.fingerprint, key.name]));
	const findings: Finding[] = [];
	const signatures = record.signatures.map((signature, index): SignatureReport => {
		const valid = checks?.[index]?.valid ?? false;
		const trustedAs = byFingerprint.get(signature.fingerprint);
		const level = signature.fingerprint === trust.own ? 'own' : trustedAs !== undefined ? 'trusted' : 'untrusted';
		if (valid && level === 'untrusted') findings.push(finding('trust', 'audit-untrusted-key', {index: index + 1, signer: signature.signer.name, fingerprint: signature.fingerprint}));
		return {
			index: index + 1,
			signer: signature.signer,
			meaning: signature.meaning,
			signedAt: signature.signedAt,
			fingerprint: signature.fingerprint,
			valid,
			trust: level,
			...(level === 'trusted' ? {trustedAs: trustedAs!} : {}),
		};
	});
	return {signatures, findings};
}
