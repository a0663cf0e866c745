import {createHash} from 'node:crypto';

/** SHA-256 of text (as UTF-8) or bytes, in lower-case hex: how prelase names rule files, plans, bodies and keys. */
export function sha256Hex(data: string | Uint8Array): string {
	return createHash('sha256').update(data).digest('hex');
}
