import type {KeyObject} from 'node:crypto';
import type {BenchRecord, RecordBody} from './record-schema.js';
import {signBody, type Signer} from './sign.js';

/** A record with its body signed by each signer in turn (the operator first). */
export function signRecord(body: RecordBody, signers: ReadonlyArray<{signer: Signer; key: KeyObject}>, now?: Date): BenchRecord {
	return {format: 'prelase-record', version: 1, body, signatures: signers.map(({signer, key}) => signBody(body, signer, key, now))};
}
