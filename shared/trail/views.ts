/** The trail as the API returns it: entries and the result of checking the hash chain. */
export interface TrailEntryView {
  seq: number;
  occurredAt: string;
  actorUserId: number | null;
  organisationId: number | null;
  actorName: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  details: Record<string, unknown> | null;
  hash: string;
}

export interface ChainVerification {
  ok: boolean;
  checked: number;
  lastSeq: number;
  firstBroken?: { seq: number; reason: string };
}

/** A signed statement of the trail's size and Merkle root at a moment (RFC 9162 §4.10), for a party to keep. */
export interface SignedTreeHead {
  treeSize: number;
  /** ISO 8601, UTC; part of what is signed. */
  timestamp: string;
  /** Hex SHA-256 Merkle tree hash of the first treeSize entries (RFC 9162 §2.1.1). */
  rootHash: string;
  algorithm: "Ed25519";
  /** Hex SHA-256 of the public key (SubjectPublicKeyInfo, DER). */
  keyId: string;
  /** Base64 Ed25519 signature over the head's signed text. */
  signature: string;
}

export interface InclusionProof {
  seq: number;
  leafIndex: number;
  treeSize: number;
  leafHash: string;
  path: string[];
  rootHash: string;
}

export interface ConsistencyProof {
  from: number;
  to: number;
  fromRoot: string;
  toRoot: string;
  path: string[];
}

/** What checking a kept head against the trail now found. */
export interface KeptHeadCheck {
  /** Cellarpact's key signed exactly this head. */
  signatureValid: boolean;
  /** The trail now extends the kept head's tree unchanged (RFC 9162 §2.1.4 consistency). */
  consistent: boolean;
  keptSize: number;
  currentSize: number;
  /** Why not, when either is false. */
  reason: string | null;
}
