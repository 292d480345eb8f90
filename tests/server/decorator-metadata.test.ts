import { Column, ColumnTypeUndefinedError, Entity, PrimaryGeneratedColumn } from "typeorm";
import { User } from "../../server/users/user.entity";
import { entities } from "../../server/db/entities";
import { getMetadataArgsStorage } from "typeorm";

/**
 * Issue 11: Jest compiles the server as tsx does under `npm start` — no decorator metadata (jest.config.js) — so a
 * column that leans on TypeScript's design:type instead of an explicit `type` fails here as it fails at start-up.
 * reflect-metadata is loaded (the project's setupFiles), so these would pass with metadata switched on.
 */
describe("decorator metadata, as under tsx", () => {
  it("reflect-metadata is loaded, and entity properties carry no design:type", () => {
    expect(typeof Reflect.getMetadata).toBe("function");
    expect(Reflect.getMetadata("design:type", User.prototype, "email")).toBeUndefined();
    expect(Reflect.getMetadata("design:type", User.prototype, "disabled")).toBeUndefined();
  });

  it("an entity column without an explicit type throws TypeORM's ColumnTypeUndefinedError", () => {
    const defineUntyped = () => {
      @Entity({ name: "untyped_probe" })
      class UntypedProbe {
        @PrimaryGeneratedColumn()
        id: number;

        @Column()
        name: string;
      }
      return UntypedProbe;
    };
    expect(defineUntyped).toThrow(ColumnTypeUndefinedError);
  });

  it("every column of every entity names its type", () => {
    const targets = new Set<unknown>(entities);
    const untyped = getMetadataArgsStorage().columns.filter((c) => targets.has(c.target) && !c.options.type && c.mode === "regular");
    expect(untyped.map((c) => `${(c.target as { name: string }).name}.${c.propertyName}`)).toEqual([]);
  });
});
