import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** A signed-out session: its token id is refused until the token's own expiry, then the row is cleared. */
@Entity('revoked_sessions')
@Index('revoked_sessions_expires_at', ['expiresAt'])
export class RevokedSession {
  @PrimaryColumn({ type: 'uuid' }) jti: string;
  @Column({ name: 'user_id', type: 'uuid' }) userId: string;
  @Column({ name: 'expires_at', type: 'timestamptz' }) expiresAt: Date;
  @Column({ name: 'revoked_at', type: 'timestamptz', default: () => 'now()' }) revokedAt: Date;
}
