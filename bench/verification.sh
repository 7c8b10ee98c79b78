#!/usr/bin/env bash
# Regenerates docs/verification.md from a run of the verification tests.
# Usage: bench/verification.sh   (from the project root; needs Maven; kubectl on PATH for the
# differential row, otherwise that row says it was skipped)
#        FUZZ_SECONDS=240 bench/verification.sh   (fuzz each target longer; default 15 s, as CI)
set -euo pipefail
cd "$(dirname "$0")/.."
log=$(mktemp)
trap 'rm -f "$log"' EXIT
tests='KubectlDescribeDifferentialTest,BadInputCorpusTest,BoundedResourcesTest,OddButValidInputTest,RandomInputProperties,ClusterFaultsCliTest,SecretsAndReadOnlyTest,ClusterReaderCutOffTest,ListItemsTest'
mvn -B -o test -Dtest="$tests" -Dsurefire.failIfNoSpecifiedTests=false >"$log" 2>&1 || {
  tail -60 "$log"; echo "verification tests failed; docs/verification.md left unchanged" >&2; exit 1; }
fuzz_seconds=${FUZZ_SECONDS:-15}
fuzz_out=$(bench/fuzz.sh "$fuzz_seconds") || {
  echo "$fuzz_out"; echo "fuzzing found a crash; docs/verification.md left unchanged" >&2; exit 1; }
mvn -B -o failsafe:integration-test -Dit.test=LargeDocumentIT >>"$log" 2>&1 || {
  tail -60 "$log"; echo "LargeDocumentIT failed; docs/verification.md left unchanged" >&2; exit 1; }
fuzz() { # target class -> "N runs in S s, C crashes"
  echo "$fuzz_out" | grep -m1 "^fuzz $1:" \
    | sed -E 's/.*Done ([0-9]+) runs in ([0-9]+) second\(s\), crashes: ([0-9]+).*load average (.*)$/\1 executions in \2 s, \3 crashes (load average \4)/'
}
large_line=$(grep -m1 '^large document:' "$log" || echo "not run")
kubectl_line=$(grep -m1 -E '^kubectl differential:|^SKIPPED: kubectl differential' "$log" || echo "not run")
corpus_line=$(grep -m1 '^bad-input corpus:' "$log" || echo "not run")
tries() { # property name -> "tries = N" of its jqwik report
  grep -A8 "RandomInputProperties:${1//_/ }" "$log" | grep -m1 -oE 'tries = [0-9]+' | grep -oE '[0-9]+' || echo "?"
}
count() { # test class -> "run/failures" from Surefire
  grep -m1 -E "Tests run: .* in dev\.numafit\..*\.$1\$" "$log" | sed -E 's/.*Tests run: ([0-9]+), Failures: ([0-9]+), Errors: ([0-9]+), Skipped: ([0-9]+).*/\1 run, \2 failed, \3 errors, \4 skipped/'
}
cat > docs/verification.md <<DOC
# Verification figures

What was tried against numafit's readers and arithmetic, and what held. Regenerate with
\`bench/verification.sh\` (it runs the tests named below and rewrites this file; no timestamps, so
an unchanged result gives an unchanged file).

> Caution: these tests check numafit against Kubernetes' own arithmetic and against broken
> input; they do not check your hardware. Verify a plan against your hardware's documentation and
> a load test, and follow your organisation's change practice.

| what | test | result |
| --- | --- | --- |
| kubectl agreement: per-pod CPU and memory requests and limits, \`kubectl describe node\` (1.32) against numafit, seeded random pods (sidecars before and after init containers, overhead, limits-only containers, odd quantities); pod-level \`spec.resources\` left out (outside kubectl 1.32's arithmetic) | KubectlDescribeDifferentialTest | ${kubectl_line} |
| bad inputs, each answered with its expected \`file:line\` message, the valid input of the same run kept, no stack trace | BadInputCorpusTest (src/test/resources/bad-input) | ${corpus_line} |
| hostile inputs in a 192 MB heap: a 50 MB manifest generated in the test, an alias bomb, 10,000-deep nesting; raising the size limit | BoundedResourcesTest | $(count BoundedResourcesTest) |
| odd but valid inputs: CRLF, UTF-8 BOM, UTF-16 with BOM, CPU finer than 1m, two JSON objects back to back, flow style with trailing commas | OddButValidInputTest | $(count OddButValidInputTest) |
| random-input tests (jqwik, not coverage-guided): manifest reader | RandomInputProperties | $(tries manifestReader_randomText) tries, no exception |
| random-input tests: host-profile reader | RandomInputProperties | $(tries hostProfileReader_randomText) tries, no exception |
| random-input tests: snapshot reader | RandomInputProperties | $(tries snapshotReader_randomText) tries, no exception |
| random-input tests: quantity path | RandomInputProperties | $(tries quantityPath_randomAmount) tries, no exception |
| faults: expired token (401), untrusted certificate, unknown context: one message, exit 2, no snapshot written, only GET requests | ClusterFaultsCliTest | $(count ClusterFaultsCliTest) |
| secrets: a known fake token and password never in stdout, stderr or the snapshot file with --verbose; only GET requests | SecretsAndReadOnlyTest | $(count SecretsAndReadOnlyTest) |
| faults: a page cut off mid-body (Content-Length larger than the body) with the connection left open past --request-timeout, and with the connection closed: one message naming the server, no partial result, only GET requests | ClusterReaderCutOffTest | $(count ClusterReaderCutOffTest) |
| coverage-guided fuzzing (Jazzer, ${fuzz_seconds} s, own JVM): quantity path | QuantityFuzzTest | $(fuzz QuantityFuzzTest) |
| coverage-guided fuzzing: manifest reader | ManifestFuzzTest | $(fuzz ManifestFuzzTest) |
| coverage-guided fuzzing: host-profile reader | HostProfileFuzzTest | $(fuzz HostProfileFuzzTest) |
| coverage-guided fuzzing: snapshot reader | SnapshotFuzzTest | $(fuzz SnapshotFuzzTest) |
| a 50 MB manifest that is one YAML document (a List of Pods, generated), \`--max-document-size 64Mi\`, read to the end in a separate JVM | LargeDocumentIT | ${large_line} |

Also covered elsewhere: paging, expired continue tokens, 403/429/500, slow answers, a truncated
body and a refused connection (ClusterReaderFaultTest); output files are written through a
temporary file and a rename (ReportOutput), and \`--out\` naming one of the run's inputs is refused
before anything is read (Main.outputOverInput, MainOutputOverInputTest).

## Found and fixed

- Sub-millicore amounts were rounded up per container before summing; kubectl (and the scheduler,
  which reads the exact pod total with MilliValue) round once: three containers of 0.1m ask for
  1m, not 3m. Container amounts are now kept to 1n, as the API server does, and only the pod
  total is rounded (regression tests in PodArithmeticTest).
- A YAML alias bomb made the manifest reader expand aliases without bound; aliases may now copy at
  most 100,000 values per document.
- A snapshot of bytes that are not text ended in an internal error; it is now refused as not
  UTF-8. A snapshot with content after its object, or with a negative amount, was accepted; both
  are refused now.
- A manifest without \`metadata.name\` was sized silently; it now carries a warning.
- A 50 MB manifest was read whole into memory; inputs above the size limit (32Mi characters by
  default, \`--max-document-size\` to raise it) are now refused before they are read.
- An API server answer cut off mid-body (a Content-Length larger than the body) with the
  connection left open kept \`numafit snapshot\` waiting for ever: the client's request timeout
  ends when the response headers arrive. The request timeout now covers the whole answer, body
  included (ResponseDeadline), and the read stops with "the API server URL did not answer list
  pods within N s (--request-timeout); nothing of its answer was used" (ClusterReaderCutOffTest,
  a plain-socket server that cuts page 2 of the pod list; without the fix the test hangs until its
  60 s guard).
- A 50 MB manifest that is one YAML document (a List of about 230,000 Pods) with
  \`--max-document-size 64Mi\` ran out of a 1 GB heap after about ten minutes: the whole tree
  and a line table entry for every value were held at once. The items of a list whose \`kind\`
  comes before \`items\` (as YAML lists are usually written) are now read one by one
  (ListItemsTest: same workloads and messages as a list read whole); the reading then fits in
  1 GB, and the JSON report of 230,000 workloads needs the rest of a 2 GB heap (LargeDocumentIT).
  A list whose \`kind\` follows its \`items\` (\`kubectl get -o json\` orders keys so) is
  still read whole.
- Coverage-guided fuzzing found no crash in the runs recorded above.

## Limits and open points

- Parser limits: 32Mi characters per input file, standard input and document
  (\`--max-document-size\`), nesting 500 levels, 100,000 values copied through YAML aliases per
  document.
- Fuzzing: four Jazzer targets (src/test/java/dev/numafit/verify/fuzz), each property "a result
  or numafit's own refusal naming the file, no other exception, each input within 10 s". A plain
  \`mvn verify\` runs them in regression mode over their seed inputs
  (src/test/resources/dev/numafit/verify/fuzz/*Inputs/); CI (\`.ci/run\`) then fuzzes each for
  15 s in its own JVM with \`bench/fuzz.sh 15\`. A longer local run:
  \`mvn -B test-compile && bench/fuzz.sh 600\` (ten minutes per target), or one target:
  \`FUZZ_TARGETS=ManifestFuzzTest bench/fuzz.sh 3600\`. New coverage is kept in
  .cifuzz-corpus/ (not committed) and reused by the next run; a crashing input is written into
  the target's seed directory, where it becomes a regression test: commit it with its fix.
- The random-input tests (jqwik) stay beside the fuzz targets: they run in every build at no
  start-up cost.
DOC
echo "wrote docs/verification.md"
