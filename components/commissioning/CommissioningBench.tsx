"use client";
/**
 * The pre-commissioning flow: the Bench itself, opened on the plant, with the hand-over path
 * above it and the site proof-test editor inside its experiments. Nothing of the Bench is copied:
 * the path reads the Bench's store and asks it to bring panels into view.
 */
import { BenchApp, type BenchStartPlant } from "@/components/bench/BenchApp";
import { HandoverPath } from "./HandoverPath";
import { ProofTestBuilder } from "./ProofTestBuilder";

export function CommissioningBench({ plant }: { plant: BenchStartPlant }) {
  return (
    <BenchApp
      startPlant={plant}
      commissioning={{
        header: <HandoverPath plantRef={plant.ref} plantName={plant.title} origin={plant.origin} privatePlant={plant.privateToUser ?? false} />,
        proofEditor: (baseDrill) => <ProofTestBuilder baseDrill={baseDrill} />,
      }}
    />
  );
}
