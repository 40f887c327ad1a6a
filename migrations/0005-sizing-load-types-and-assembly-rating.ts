import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// The sizing corrections of BS 7671:2018+A2:2022 need three things the data did not hold:
// - boards.conditional_rating_ka: the rated conditional short-circuit current of the board's
//   assembly (BS EN 61439-3), when its maker declares one; null for every existing board
//   (nothing is assumed).
// - ways.circuit.loadType: the kind of load, which picks the diversity allowance. Existing
//   circuits get one ONCE here, from their use and, for fixed loads, their description; from
//   now on the designer chooses it and the engine never reads the description.
// - a supply's Uo is line-to-earth (100–277 V): a board saved with a line-to-line value
//   (e.g. 400 V) gets its line-to-earth value (230 V); nothing else in the supply changes.
// Special locations and the armoured-cable cpc are optional fields with safe defaults
// (none; spare core single-phase, armour three-phase), so existing ways need no value.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    alter table boards add column conditional_rating_ka double precision
      check (conditional_rating_ka is null or (conditional_rating_ka > 0 and conditional_rating_ka <= 200));

    update boards set supply = jsonb_set(supply, '{uoV}', to_jsonb(
      case (supply->>'uoV')::numeric
        when 400 then 230 when 415 then 240 when 380 then 220 when 480 then 277
        else round((supply->>'uoV')::numeric / sqrt(3))
      end))
    where (supply->>'uoV')::numeric > 277;

    update ways set circuit = circuit || jsonb_build_object('loadType',
      case
        when circuit->>'use' = 'lighting' then 'lighting'
        when circuit->>'use' = 'sockets' then 'sockets'
        when circuit->>'use' = 'distribution' then 'other'
        when coalesce(circuit->>'serves', '') ~* '(ev|vehicle|car) ?charg|charging point' then 'ev-charger'
        when coalesce(circuit->>'serves', '') ~* 'storage heat' then 'storage-heating'
        when coalesce(circuit->>'serves', '') ~* 'shower|instantaneous' then 'shower'
        when coalesce(circuit->>'serves', '') ~* 'immersion|water heater|cylinder|boiler' then 'water-heater'
        when coalesce(circuit->>'serves', '') ~* 'cook|oven|hob' then 'cooker'
        when coalesce(circuit->>'serves', '') ~* 'motor|compressor|pump|saw|extract|drill|grinder|lathe|moulder|planer' then 'motor'
        else 'other'
      end)
    where circuit is not null and jsonb_typeof(circuit) = 'object' and not circuit ? 'loadType';
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    update ways set circuit = circuit - 'loadType' - 'specialLocation' - 'armouredCpc' - 'inDucts'
      where circuit is not null and jsonb_typeof(circuit) = 'object';
    update ways set circuit = jsonb_set(circuit, '{grouping}', (circuit->'grouping') - 'spacingM')
      where circuit is not null and jsonb_typeof(circuit->'grouping') = 'object';
    alter table boards drop column conditional_rating_ka;
  `);
};
