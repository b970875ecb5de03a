// The statements planted into WordNet so that every built-in rule has a non-zero count to compare.
import type { NounSynset } from './noun-data.js';
import { WORDNET_NAMESPACE, synsetIri, type PlantedStatement } from './wordnet-rdf.js';

/**
 * Statements on rail synsets of WordNet (our Northvale Rail flavour): a subclass 2-cycle and a
 * self-loop, a class with two direct superclasses in that cycle, a part-of 2-cycle made of a part holonym and a part meronym, kind-and-part,
 * instance-and-subclass, a redundant direct superclass, an in-scope orphan and an out-of-scope
 * one (which must not be reported), two disjointness axioms (one with overlaps, one without) and a
 * deprecated class that is in use. Synsets are looked up by word, never by a remembered offset.
 */
export function plantVariation(synsets: NounSynset[]): PlantedStatement[] {
  const byOffset = new Map(synsets.map((synset) => [synset.offset, synset]));
  const hypernymsOf = (synset: NounSynset): NounSynset[] =>
    synset.pointers.filter((pointer) => pointer.symbol === '@').map((pointer) => byOffset.get(pointer.target) as NounSynset);
  const byWord = (word: string, hypernymWord?: string): NounSynset => {
    const found = synsets.filter(
      (synset) =>
        synset.words.includes(word) &&
        (hypernymWord === undefined || hypernymsOf(synset).some((hypernym) => hypernym.words.includes(hypernymWord))),
    );
    if (found.length !== 1) throw new Error(`expected one synset for "${word}" under "${hypernymWord ?? ''}", found ${found.length}`);
    return found[0];
  };
  const iri = (synset: NounSynset): string => synsetIri(synset.offset);
  const railcar = byWord('railcar');
  const freightCar = byWord('freight_car');
  const passengerCar = byWord('passenger_car');
  const train = byWord('railroad_train');
  const carWheel = byWord('car_wheel');
  const wheel = byWord('wheel', 'machine');
  const pantograph = byWord('pantograph');
  const locomotive = byWord('locomotive');
  const wheeledVehicle = byWord('wheeled_vehicle');
  const boxcar = byWord('boxcar');
  const [locomotiveParent] = hypernymsOf(locomotive);
  const [locomotiveGrandparent] = hypernymsOf(locomotiveParent);
  return [
    { kind: 'hypernym', subject: iri(railcar), object: iri(freightCar) },
    { kind: 'hypernym', subject: iri(pantograph), object: iri(pantograph) },
    // boxcar is already under freight_car; with railcar too, its two superclasses share the cycle above.
    { kind: 'hypernym', subject: iri(boxcar), object: iri(railcar) },
    { kind: 'partMeronym', subject: iri(train), object: iri(railcar) },
    { kind: 'partHolonym', subject: iri(train), object: iri(railcar) },
    { kind: 'partHolonym', subject: iri(carWheel), object: iri(wheel) },
    { kind: 'instanceHypernym', subject: iri(passengerCar), object: iri(wheeledVehicle) },
    { kind: 'hypernym', subject: iri(locomotive), object: iri(locomotiveGrandparent) },
    { kind: 'hypernym', subject: iri(pantograph), object: `${WORDNET_NAMESPACE}synset/planted-current-collector` },
    { kind: 'hypernym', subject: iri(locomotive), object: 'https://elsewhere.example/def/RailVehicle' },
    { kind: 'disjointWith', subject: iri(byWord('physical_entity')), object: iri(byWord('abstraction', 'entity')) },
    { kind: 'disjointWith', subject: iri(locomotive), object: iri(passengerCar) },
    { kind: 'deprecated', subject: iri(wheeledVehicle) },
  ];
}
