import { DataTypes, Model, type Sequelize } from 'sequelize';

import { ROLES, type Role } from './user';

export class Invitation extends Model {
  declare id: string;
  declare organisationId: string;
  declare email: string;
  declare name: string;
  declare role: Role;
  /** SHA-256 of the one-time token; the token itself is only ever in the e-mail. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare invitedById: string;
  declare createdAt: Date;

  static setup(sequelize: Sequelize): void {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        invitedById: { type: DataTypes.UUID, allowNull: false },
      },
      { sequelize, tableName: 'invitations', underscored: true },
    );
  }
}
