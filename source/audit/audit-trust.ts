import type {SignatureCheck} from '../records/integrity.js';
import {finding, type Finding} from '../records/findings.js';
import type {TrustedKey} from '../records/key-files.js';
import {sameName} from '../records/key-name.js';
import type {AnyRecord, Signature} from '../records/record-schema.js';
import {purposeOf, type Purpose} from '../records/signature-purpose.js';
import {isAuthorityRole, revokedAt} from './signing-policy.js';

/** The keys an auditor trusts: their own (and the name it carries) and the colleagues' they have added. */
export type Trust = {own?: string | undefined; ownName?: string | undefined; trusted: readonly TrustedKey[]};

/** One signature as the audit reports it: who, as what, for what, when, with which key, and whether that key is trusted. */
export type SignatureReport = {
	index: number;
	signer: Signature['signer'];
	/** What the signature is for (a version 1 meaning read as its purpose). */
	purpose: Purpose;
	/** The meaning a version 1 signature states; absent for version 2. */
	meaning?: Signature['meaning'];
	signedAt: string;
	fingerprint: string;
	valid: boolean;
	/** `own`: the auditor's own key; `trusted`: in their list (as `trustedAs`); `untrusted`: neither. */
	trust: 'own' | 'trusted' | 'untrusted';
	trustedAs?: string;
	/** The roles the auditor's trust list grants this key. */
	granted?: string[];
	/** Valid, by a key the auditor trusts (their own or listed), and not made after the key was revoked: only this is called authentic. */
	authentic: boolean;
};

/**
 * Names each signer with their role, purpose and key, and whether the key is trusted. Findings:
 * a valid signature with an untrusted key (intact, signer unknown); a stated name that is not
 * the name under which the auditor trusts the key; a claimed authority role the trust list does
 * not grant (the auditor's own key vouches for itself); a signature made after its key was
 * revoked.
 */
export function signatureReports(record: AnyRecord, checks: readonly SignatureCheck[] | undefined, trust: Trust, authorityRoles?: readonly string[]): {signatures: SignatureReport[]; findings: Finding[]} {
	const byFingerprint = new Map(trust.trusted.map((key) => [key.fingerprint, key]));
	const findings: Finding[] = [];
	const signatures = record.signatures.map((signature, index): SignatureReport => {
		const valid = checks?.[index]?.valid ?? false;
		const listed = byFingerprint.get(signature.fingerprint);
		const level = signature.fingerprint === trust.own ? 'own' : listed !== undefined ? 'trusted' : 'untrusted';
		const who = {index: index + 1, signer: signature.signer.name};
		let revoked = false;
		if (valid && level === 'untrusted') findings.push(finding('trust', 'audit-untrusted-key', {...who, fingerprint: signature.fingerprint}));
		if (valid && level !== 'untrusted') {
			const trustedAs = level === 'own' ? trust.ownName : listed!.name;
			if (trustedAs !== undefined && !sameName(signature.signer.name, trustedAs)) findings.push(finding('trust', 'audit-signer-name-differs', {index: index + 1, stated: signature.signer.name, trusted: trustedAs}));
			if (level === 'trusted' && isAuthorityRole(signature.signer.role, authorityRoles) && !(listed!.roles ?? []).some((role) => sameRole(role, signature.signer.role))) {
				findings.push(finding('trust', 'audit-role-not-granted', {...who, role: signature.signer.role}));
			}
			const from = listed?.revokedFrom;
			if (from !== undefined && revokedAt(signature.signedAt, from)) {
				revoked = true;
				findings.push(finding('trust', 'audit-signed-after-revocation', {...who, signedAt: signature.signedAt, trusted: listed!.name, from}));
			}
		}
		return {
			index: index + 1,
			signer: signature.signer,
			purpose: purposeOf(signature),
			...(signature.meaning ? {meaning: signature.meaning} : {}),
			signedAt: signature.signedAt,
			fingerprint: signature.fingerprint,
			valid,
			trust: level,
			...(level === 'trusted' ? {trustedAs: listed!.name, granted: listed!.roles ?? []} : {}),
			authentic: valid && level !== 'untrusted' && !revoked,
		};
	});
	return {signatures, findings};
}

/** Roles compared as the policy compares them: case-insensitive, trimmed, runs of blanks as one. */
export function sameRole(a: string, b: string): boolean {
	const fold = (text: string) => text.trim().replace(/\s+/g, ' ').toLowerCase();
	return fold(a) === fold(b);
}
