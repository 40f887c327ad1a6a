import { DataTypes, Model, type Sequelize } from 'sequelize';

import { ROLES, type Role } from '@/lib/domain';

export { ROLES, type Role };

export class User extends Model {
  declare id: string;
  declare organisationId: string;
  declare email: string;
  declare name: string;
  declare passwordHash: string | null;
  declare role: Role;
  declare active: boolean;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
