import { contradiction } from '../../src/checks/contradiction.ts';
import { checkTable } from './check-table.ts';

// Texts written for this project. Traps (must not be flagged) follow the design's list: a warning in
// the negative is not contradicted by a later instruction to avoid the same thing; "not only … but also"
// is not negation; conditional statements are not compared.
checkTable(contradiction, {
  flagged: [
    { text: 'It is safe to cook in the vestibule. It is not safe to cook in the vestibule.', expect: [{ message: 'negation', evidence: 'It is not safe to cook in the vestibule.' }] },
    { text: 'Wrap the ankle tightly and keep walking. Do not wrap the ankle.', expect: [{ message: 'negation', evidence: 'Do not wrap the ankle.' }] },
    { text: 'Snow is safe to eat. Snow is not safe to eat.', expect: [{ message: 'negation', evidence: 'Snow is not safe to eat.' }] },
    { text: 'Cover the fire with dirt. Never cover the fire with dirt.', expect: [{ message: 'negation', evidence: 'Never cover the fire with dirt.' }] },
    { text: 'The battery lasts 4 hours on high. The battery lasts 9 hours on high.', expect: [{ message: 'number', evidence: 'The battery lasts 9 hours on high.' }] },
    { text: 'Boil the water for 1 minute. Please boil the water for 10 minutes.', expect: [{ message: 'number', evidence: 'Please boil the water for 10 minutes.' }] },
    { text: 'The stove weighs 300 grams. Packed, the stove weighs 450 grams.', expect: [{ message: 'number', evidence: 'Packed, the stove weighs 450 grams.' }] },
    { text: 'Keep the tent door open at night. Keep the tent door closed at night.', expect: [{ message: 'antonym', evidence: 'Keep the tent door closed at night.' }] },
    { text: 'These orange mushrooms are edible. These orange mushrooms are poisonous.', expect: [{ message: 'antonym', evidence: 'These orange mushrooms are poisonous.' }] },
    { text: 'Store the canister inside the car. Store the canister outside the car.', expect: [{ message: 'antonym', evidence: 'Store the canister outside the car.' }] },
    { text: 'Gas canisters are allowed in carry-on bags. Gas canisters are prohibited in carry-on bags.', expect: [{ message: 'antonym', evidence: 'Gas canisters are prohibited in carry-on bags.' }] },
    { text: 'Return the tent within 60 days. Return the tent within 30 days.', expect: [{ message: 'number', evidence: 'Return the tent within 30 days.' }] },
    { text: 'The trail climbs 800 metres to the hut. From the car park the trail climbs 1,200 metres to the hut.', expect: [{ message: 'number', evidence: 'From the car park the trail climbs 1,200 metres to the hut.' }] },
    { text: 'You can drink the stream water straight away. You cannot drink the stream water straight away.', expect: [{ message: 'negation', evidence: 'You cannot drink the stream water straight away.' }] },
    { text: 'Pop the blister with a needle. You should never pop the blister with a needle.', expect: [{ message: 'negation', evidence: 'You should never pop the blister with a needle.' }] },
    { text: 'The jacket is machine washable. The jacket is not machine washable.', expect: [{ message: 'negation', evidence: 'The jacket is not machine washable.' }] },
    { text: 'Dry the boots near the fire. Dry the boots away from heat. Do not dry the boots near the fire.', expect: [{ message: 'negation', evidence: 'Do not dry the boots near the fire.' }] },
    { text: 'Lightning is harmless to hikers on ridges. Lightning is harmful to hikers on ridges.', expect: [{ message: 'antonym', evidence: 'Lightning is harmful to hikers on ridges.' }] },
    { text: 'The sleeping bag is rated to 5 degrees. In the shop the sleeping bag is rated to minus 10 degrees, I mean 12 degrees.', expect: [{ message: 'number', evidence: 'In the shop the sleeping bag is rated to minus 10 degrees, I mean 12 degrees.' }] },
    { text: 'Tents used once can be returned for a refund. Tents used once cannot be returned for a refund.', expect: [{ message: 'negation', evidence: 'Tents used once cannot be returned for a refund.' }] },
  ],
  clean: [
    'Never mix fuels in one bottle. Avoid mixing fuels in one bottle at all times.',
    'Never use the stove inside the tent. Use the stove outside the tent.',
    'Not only is the jacket warm, but it is also light. The jacket is warm.',
    'Boil the water for 1 minute. Above 2,000 metres, boil the water for 3 minutes.',
    'Do not pop the blister. Cover the blister with a plaster.',
    'The comfort rating is the lowest temperature for a relaxed sleeper. The lower limit is colder and assumes a curled-up sleeper.',
    'Drown the fire with water, stir the ashes, and drown it again. Never leave a fire that is still warm.',
    'Keep at least 25 metres away from a moose. If it has a calf, keep further away.',
    'The Ember 2 takes screw-thread canisters. Liquid fuels will not fit it.',
    'Stake the upwind corners first. Then add the poles and clip the body.',
    'You can return used gear within 60 days. Clearance items cannot be returned unless they are faulty.',
    'Eating snow cools you down. Melt snow before you drink it.',
    'The battery lasts 4 hours on high. The battery lasts 40 hours on low.',
    'Do not eat wild mushrooms. Several poisonous species look like edible ones.',
    'Pitch with the narrow end into the wind. Finish with all guy lines.',
    'Wash the jacket gently. Do not use fabric softener on the jacket.',
    'I cannot stress this enough: check the weather. Check the weather before every hike.',
    'It shipped on Monday. It should arrive within 3 to 5 working days.',
    'Rain drums soft on the tent at night, and morning comes up washed and bright.',
    '',
  ],
});
