import type {KeyObject} from 'node:crypto';
import type {AnyBody} from './record-schema.js';
import {signBody, type Signer} from './sign.js';

/** A record with its body signed by each signer in turn (the operator or tester first). */
export function signRecord<Body extends AnyBody>(body: Body, signers: ReadonlyArray<{signer: Signer; key: KeyObject}>, now?: Date) {
	return {format: 'prelase-record' as const, version: 1 as const, body, signatures: signers.map(({signer, key}) => signBody(body, signer, key, now))};
}
