type VariationsToAcceptProps = {
  variations: readonly { text: string }[];
  /** Who is signing, as the sentence needs it: "you", "the customer". */
  signer: 'you' | 'the customer';
  headingLevel?: 2 | 3 | 4 | 5;
};

/** The variations a signature accepts, listed in full right above where the signing is done. */
export function VariationsToAccept({
  variations,
  signer,
  headingLevel = 3,
}: VariationsToAcceptProps) {
  const Heading = `h${headingLevel}` as const;
  const accepts = signer === 'you' ? 'you accept' : 'the customer accepts';
  return (
    <div className="grid gap-2">
      <Heading className={headingLevel === 2 ? 'text-xl font-semibold' : 'font-semibold'}>
        Variations to accept
      </Heading>
      {variations.length === 0 ? (
        <p>
          There are no variations: the system was installed as designed. By signing {accepts} the
          handover as it is.
        </p>
      ) : (
        <>
          <p className="font-semibold">By signing {accepts} these variations:</p>
          <ol className="grid list-decimal gap-2 pl-6">
            {variations.map((variation, index) => (
              <li key={`${index}-${variation.text}`} className="whitespace-pre-line">
                {variation.text}
              </li>
            ))}
          </ol>
        </>
      )}
    </div>
  );
}
