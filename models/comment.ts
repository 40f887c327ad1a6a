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
  /** When the designer marked the comment answered (null while open). */
  declare answeredAt: Date | null;
  declare answeredById: string | null;

  static setup(sequelize: Sequelize): void {
    Comment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        boardId: { type: DataTypes.UUID, allowNull: false },
        wayId: { type: DataTypes.UUID, allowNull: true },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        answeredAt: { type: DataTypes.DATE, allowNull: true },
        answeredById: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'comments', underscored: true, updatedAt: false },
    );
  }
}
