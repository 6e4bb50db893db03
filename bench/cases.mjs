// Named benchmark cases: each builds an exactdraw sampler from a seed.
// `reference` names the peer the ratio is taken against.

/** Worked example used across the suite: a multimodal unnormalized density. */
function multimodal(x) {
  const s6 = Math.sin(6 * x), c1 = Math.cos(x), s4 = Math.sin(4 * x);
  return -0.5 * x * x + Math.log(s6 * s6 + 3 * c1 * c1 * s4 * s4 + 1);
}

export function cases(ed) {
  const list = [
    {
      name: 'rejection normal / cauchy proposal',
      reference: '@stdlib improved-ziggurat normal',
      make: (seed) => ed.rejectionSampler(ed.normalTarget(0, 1), { proposal: ed.cauchyProposal(0, 1), seed }),
    },
    {
      name: 'rejection multimodal / U(-3,3), C = 25',
      reference: 'mt19937 uniform (raw)',
      make: (seed) =>
        ed.rejectionSampler(
          { logDensity: (x) => (x >= -3 && x <= 3 ? multimodal(x) : -Infinity), support: [-3, 3] },
          { proposal: ed.uniformProposal(-3, 3), logBound: Math.log(25), seed },
        ),
    },
    {
      name: 'rejection multimodal / N(0,1), C = 11',
      reference: 'mt19937 uniform (raw)',
      make: (seed) => ed.rejectionSampler({ logDensity: multimodal }, { proposal: ed.normalProposal(0, 1), logBound: Math.log(11), seed }),
    },
  ];
  if (typeof ed.adaptiveRejectionSampler === 'function') {
    list.push(
      {
        name: 'adaptive hull normal (log transform)',
        reference: '@stdlib improved-ziggurat normal',
        make: (seed) => ed.adaptiveRejectionSampler(ed.normalTarget(0, 1), { seed }),
      },
      {
        name: 'adaptive hull gamma(2.5)',
        reference: '@stdlib gamma(2.5)',
        make: (seed) => ed.adaptiveRejectionSampler(ed.gammaTarget(2.5, 1), { seed }),
      },
    );
  }
  if (typeof ed.ratioOfUniformsSampler === 'function') {
    list.push(
      {
        name: 'ratio-of-uniforms normal',
        reference: '@stdlib improved-ziggurat normal',
        make: (seed) => ed.ratioOfUniformsSampler(ed.normalTarget(0, 1), { seed }),
      },
      {
        name: 'ratio-of-uniforms student-t(5)',
        reference: 'mt19937 uniform (raw)',
        make: (seed) => ed.ratioOfUniformsSampler(ed.studentTTarget(5), { seed }),
      },
    );
  }
  return list;
}
