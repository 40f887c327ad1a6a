import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Comment extends Model {
  declare id: string;
  declare boardId: string;
  /** Null for a comment on the whole board. */
  declare wayId: string | null;
  declare revision: number;
  declare authorId: string;
  declare body: string;
  declare createdAt: Date;

  static setup(sequelize: Sequelize): void {
    Comment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        boardId: { type: DataTypes.UUID, allowNull: false },
        wayId: { type: DataTypes.UUID, allowNull: true },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
      },
      { sequelize, tableName: 'comments', underscored: true, updatedAt: false },
    );
  }
}
