import type {BenchRecord} from './record-schema.js';
import {isRecordedCornerText} from './record-corner.js';

/**
 * A quick check that data read from a record file is a bench-check record in the shape prelase
 * writes today (the lean body, signatures of version 2), so that an audit of thousands of them
 * need not run the record schema on each (about a ninth of the audit's time per record). It only
 * ever says yes to data the record schema accepts as it is (a property test holds it to the
 * schema over mutated records); anything else, or anything unusual (an older record, an embedded
 * rule text, a margin with its SI number), gets "no", and the schema then decides and says why.
 */
export function isLeanBenchRecord(data: unknown): data is BenchRecord {
	if (!plainWith(data, recordKeys, recordKeys)) return false;
	if (data['format'] !== 'prelase-record' || (data['version'] !== 1 && data['version'] !== 2)) return false;
	const signatures = data['signatures'];
	if (!Array.isArray(signatures) || signatures.length === 0 || !signatures.every(isSignature)) return false;
	return isLeanBody(data['body']);
}

type Plain = Record<string, unknown>;

const recordKeys = new Set(['format', 'version', 'body', 'signatures']);
const bodyRequired = new Set(['kind', 'tool', 'createdAt', 'operator', 'setup', 'rules', 'outcome', 'counts', 'missingInputs', 'inputs', 'derived', 'checks', 'confirmations']);
const bodyAllowed = new Set([...bodyRequired, 'previous', 'amends', 'interlockTest', 'caution', 'deferral', 'sensitivity']);
const signatureRequired = new Set(['signer', 'signedAt', 'algorithm', 'publicKey', 'fingerprint', 'value']);
const signatureAllowed = new Set([...signatureRequired, 'meaning', 'purpose', 'endorses', 'count']);
const checkRequired = new Set(['id', 'verdict']);
const checkAllowed = new Set(['id', 'step', 'title', 'severity', 'verdict', 'relation', 'value', 'limit', 'margin', 'needs', 'message', 'error', 'reason', 'explanation', 'basis', 'corner']);
const figureKeys = new Set(['si', 'text']);
const personKeys = new Set(['name', 'role']);
const toolKeys = new Set(['name', 'version']);
const setupRequired = new Set(['name', 'fingerprint']);
const setupAllowed = new Set(['name', 'fingerprint', 'identifying']);
const rulesKeys = new Set(['name', 'file', 'sha256']);
const linkKeys = new Set(['file', 'sha256']);
const amendsKeys = new Set(['record', 'bodySha256', 'reason']);
const confirmationRequired = new Set(['status']);
const confirmationAllowed = new Set(['status', 'note', 'needs']);

const outcomes = new Set(['clear_to_energize', 'do_not_energize', 'incomplete']);
const verdicts = new Set(['pass', 'fail', 'advise', 'open', 'skip']);
const severities = new Set(['stop', 'advise']);
const relations = new Set(['at_most', 'at_least']);
const statuses = new Set(['yes', 'no', 'not_applicable', 'unanswered', 'skip', 'open']);
const meanings = new Set(['performed', 'verified', 'approved']);
const purposes = new Set(['operator', 'witness', 'approval']);

const hex64 = /^[0-9a-f]{64}$/;
const fingerprintText = /^sha256:[0-9a-f]{64}$/;
const publicKeyText = /^[A-Za-z0-9+/]{43}=$/;
const signatureText = /^[A-Za-z0-9+/]{86}==$/;

/** A plain object (from JSON.parse) with every required name and no name outside the allowed. */
function plainWith(value: unknown, required: ReadonlySet<string>, allowed: ReadonlySet<string>): value is Plain {
	if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
	let present = 0;
	for (const name in value) {
		if (!Object.hasOwn(value, name) || !allowed.has(name)) return false;
		if (required.has(name)) present += 1;
	}
	return present === required.size;
}

const isText = (value: unknown): value is string => typeof value === 'string';
const isNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);
const optional = (value: unknown, test: (item: unknown) => boolean) => value === undefined || test(value);
const textList = (value: unknown) => Array.isArray(value) && value.every(isText);
const oneOf = (options: ReadonlySet<string>) => (value: unknown) => typeof value === 'string' && options.has(value);
const matches = (pattern: RegExp) => (value: unknown) => typeof value === 'string' && pattern.test(value);
const person = (value: unknown) => plainWith(value, personKeys, personKeys) && isText(value['name']) && value['name'].length > 0 && isText(value['role']);
const figure = (value: unknown) => plainWith(value, figureKeys, figureKeys) && isNumber(value['si']) && isText(value['text']);
const textRecord = (value: unknown, test: (item: unknown) => boolean) => typeof value === 'object' && value !== null && !Array.isArray(value) && Object.values(value).every(test);

function isSignature(value: unknown): boolean {
	if (!plainWith(value, signatureRequired, signatureAllowed)) return false;
	return (
		person(value['signer']) &&
		optional(value['meaning'], oneOf(meanings)) &&
		optional(value['purpose'], oneOf(purposes)) &&
		optional(value['endorses'], (list) => Array.isArray(list) && list.every(matches(hex64))) &&
		optional(value['count'], (count) => Number.isSafeInteger(count) && (count as number) > 0) &&
		isText(value['signedAt']) &&
		value['algorithm'] === 'Ed25519' &&
		matches(publicKeyText)(value['publicKey']) &&
		matches(fingerprintText)(value['fingerprint']) &&
		matches(signatureText)(value['value'])
	);
}

function isCheck(value: unknown): boolean {
	if (!plainWith(value, checkRequired, checkAllowed)) return false;
	return (
		isText(value['id']) &&
		oneOf(verdicts)(value['verdict']) &&
		optional(value['step'], isText) &&
		optional(value['title'], isText) &&
		optional(value['severity'], oneOf(severities)) &&
		optional(value['relation'], oneOf(relations)) &&
		optional(value['value'], figure) &&
		optional(value['limit'], figure) &&
		optional(value['margin'], isText) &&
		optional(value['needs'], textList) &&
		optional(value['message'], isText) &&
		optional(value['error'], isText) &&
		optional(value['reason'], isText) &&
		optional(value['corner'], isRecordedCornerText) &&
		optional(value['explanation'], isText) &&
		optional(value['basis'], isText)
	);
}


/** A derived value as the lean body keeps it: its SI number, open (with what it needs), or not computable. */
function isDerived(value: unknown): boolean {
	if (isNumber(value)) return true;
	if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
	const names = Object.keys(value);
	if (names.length !== 1) return false;
	if (names[0] === 'open') return textList((value as Plain)['open']);
	return names[0] === 'error' && isText((value as Plain)['error']);
}

function isConfirmation(value: unknown): boolean {
	if (typeof value === 'string') return statuses.has(value);
	return plainWith(value, confirmationRequired, confirmationAllowed) && oneOf(statuses)(value['status']) && optional(value['note'], isText) && optional(value['needs'], textList);
}

function isLeanBody(body: unknown): boolean {
	if (!plainWith(body, bodyRequired, bodyAllowed)) return false;
	const {tool, setup, rules, previous, amends} = body;
	return (
		body['kind'] === 'bench-check' &&
		plainWith(tool, toolKeys, toolKeys) &&
		tool['name'] === 'prelase' &&
		isText(tool['version']) &&
		isText(body['createdAt']) &&
		person(body['operator']) &&
		plainWith(setup, setupRequired, setupAllowed) &&
		(setup['name'] === null || isText(setup['name'])) &&
		matches(fingerprintText)(setup['fingerprint']) &&
		optional(setup['identifying'], textList) &&
		(previous === undefined || previous === null || (plainWith(previous, linkKeys, linkKeys) && isText(previous['file']) && previous['file'].length > 0 && matches(hex64)(previous['sha256']))) &&
		optional(amends, (given) => plainWith(given, amendsKeys, amendsKeys) && isText(given['record']) && matches(hex64)(given['bodySha256']) && isText(given['reason']) && given['reason'].length > 0) &&
		plainWith(rules, rulesKeys, rulesKeys) &&
		isText(rules['name']) &&
		isText(rules['file']) &&
		matches(hex64)(rules['sha256']) &&
		oneOf(outcomes)(body['outcome']) &&
		textRecord(body['counts'], isNumber) &&
		textList(body['missingInputs']) &&
		textRecord(body['inputs'], isText) &&
		textRecord(body['derived'], isDerived) &&
		Array.isArray(body['checks']) &&
		body['checks'].every(isCheck) &&
		textRecord(body['confirmations'], isConfirmation) &&
		body['interlockTest'] === undefined &&
		optional(body['caution'], isText) &&
		optional(body['deferral'], isText) &&
		optional(body['sensitivity'], (given) => textRecord(given, (inputs) => textRecord(inputs, (values) => Array.isArray(values) && values.every(isNumber))))
	);
}
