import {createHash} from 'node:crypto';
import {describe, expect, it} from 'vitest';
import {privateKeyFromSeed, publicKeyFromRaw, rawPublicKey} from '../../source/records/key-material.js';
import {signBytes, verifyBytes} from '../../source/records/sign.js';

/** RFC 8032 §7.1 test vectors: secret key (the 32-byte seed), public key, message, signature. */
const vectors = [
	{
		name: 'TEST 1 (RFC 8032 §7.1)',
		secret: '9d61b19deffd5a60ba844af492ec2cc44449c5697b326919703bac031cae7f60', // RFC 8032 §7.1 TEST 1
		public: 'd75a980182b10ab7d54bfed3c964073a0ee172f3daa62325af021a68f707511a', // RFC 8032 §7.1 TEST 1
		message: '', // RFC 8032 §7.1 TEST 1 (empty message)
		signature: 'e5564300c360ac729086e2cc806e828a84877f1eb8e5d974d873e065224901555fb8821590a33bacc61e39701cf9b46bd25bf5f0595bbe24655141438e7a100b', // RFC 8032 §7.1 TEST 1
	},
	{
		name: 'TEST 2 (RFC 8032 §7.1)',
		secret: '4ccd089b28ff96da9db6c346ec114e0f5b8a319f35aba624da8cf6ed4fb8a6fb', // RFC 8032 §7.1 TEST 2
		public: '3d4017c3e843895a92b70aa74d1b7ebc9c982ccf2ec4968cc0cd55f12af4660c', // RFC 8032 §7.1 TEST 2
		message: '72', // RFC 8032 §7.1 TEST 2
		signature: '92a009a9f0d4cab8720e820b5f642540a2b27b5416503f8fb3762223ebdb69da085ac1e43e15996e458f3613d0f11d8c387b2eaeb4302aeeb00d291612bb0c00', // RFC 8032 §7.1 TEST 2
	},
	{
		name: 'TEST 3 (RFC 8032 §7.1)',
		secret: 'c5aa8df43f9f837bedb7442f31dcb7b166d38535076f094b85ce3a2e0b4458f7', // RFC 8032 §7.1 TEST 3
		public: 'fc51cd8e6218a1a38da47ed00230f0580816ed13ba3303ac5deb911548908025', // RFC 8032 §7.1 TEST 3
		message: 'af82', // RFC 8032 §7.1 TEST 3
		signature: '6291d657deec24024827e69c3abe01a30ce548a284743a445e3680d7db5ac3ac18ff9b538d16f290ae67f760984dc6594a7c15e9716ed28dc027beceea1ec40a', // RFC 8032 §7.1 TEST 3
	},
	{
		name: 'TEST SHA(abc) (RFC 8032 §7.1)',
		secret: '833fe62409237b9d62ec77587520911e9a759cec1d19755b7da901b96dca3d42', // RFC 8032 §7.1 TEST SHA(abc)
		public: 'ec172b93ad5e563bf4932c70e1245034c35467ef2efd4d64ebf819683467e2bf', // RFC 8032 §7.1 TEST SHA(abc)
		message: 'ddaf35a193617abacc417349ae20413112e6fa4e89a97ea20a9eeee64b55d39a2192992a274fc1a836ba3c23a3feebbd454d4423643ce80e2a9ac94fa54ca49f', // RFC 8032 §7.1 TEST SHA(abc)
		signature: 'dc2a4459e7369633a52b1bf277839a00201009a3efbf3ecb69bea2186c26b58909351fc9ac90b3ecfdfbc7c66431e0303dca179c138ac17ad9bef1177331a704', // RFC 8032 §7.1 TEST SHA(abc)
	},
] as const;

const hex = (text: string) => Buffer.from(text, 'hex');

/** A copy of the bytes with one bit flipped. */
function flipBit(bytes: Buffer, bit: number): Buffer {
	const copy = Buffer.from(bytes);
	copy[bit >> 3]! ^= 1 << (bit & 7);
	return copy;
}

describe('Ed25519 through the code path that signs records (RFC 8032 §7.1)', () => {
	it('the TEST SHA(abc) message is SHA-512 of "abc" (RFC 8032 §7.1)', () => {
		expect(createHash('sha512').update('abc').digest('hex')).toBe(vectors[3].message);
	});

	describe.each(vectors)('$name', (vector) => {
		const key = privateKeyFromSeed(hex(vector.secret));

		it('derives the public key from the secret key', () => {
			expect(rawPublicKey(key).toString('hex')).toBe(vector.public);
			expect(rawPublicKey(publicKeyFromRaw(hex(vector.public))).toString('hex')).toBe(vector.public);
		});

		it('signs the message to the vector signature, byte for byte', () => {
			const signature = signBytes(hex(vector.message), key);
			expect(signature.length).toBe(64);
			expect(signature.toString('hex')).toBe(vector.signature);
		});

		it('accepts the vector signature and rejects it with one bit flipped', () => {
			const publicKey = publicKeyFromRaw(hex(vector.public));
			const signature = hex(vector.signature);
			expect(verifyBytes(hex(vector.message), publicKey, signature)).toBe(true);
			for (const bit of [0, 100, 255, 256, 300, 511]) expect(verifyBytes(hex(vector.message), publicKey, flipBit(signature, bit)), `bit ${bit}`).toBe(false);
		});

		it('rejects the vector signature over a message with one more byte or one bit flipped', () => {
			const publicKey = publicKeyFromRaw(hex(vector.public));
			const signature = hex(vector.signature);
			expect(verifyBytes(Buffer.concat([hex(vector.message), Buffer.from([0])]), publicKey, signature)).toBe(false);
			if (vector.message.length > 0) expect(verifyBytes(flipBit(hex(vector.message), 0), publicKey, signature)).toBe(false);
		});

		it('rejects the vector signature under a public key with one bit flipped', () => {
			const flipped = flipBit(hex(vector.public), 7);
			let accepted = false;
			try {
				accepted = verifyBytes(hex(vector.message), publicKeyFromRaw(flipped), hex(vector.signature));
			} catch {
				accepted = false; // some flipped keys are not points on the curve at all
			}
			expect(accepted).toBe(false);
		});
	});
});
