import type {KeyObject} from 'node:crypto';
import {operatorKey} from '../../source/records/key-files.js';

/** The operator's private key in a test home (made there before); a missing key fails the test. */
export function operatorPrivateKey(home: string): KeyObject {
	const key = operatorKey(home, false);
	if (!key.ok) throw new Error(`no operator key in ${home}: ${key.errors[0]?.code}`);
	return key.value.privateKey;
}
