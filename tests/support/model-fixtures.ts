// Model files for the models API and browser tests, written by hand after the SBML-qual package specification
// ("SBML Level 3 Package: Qualitative Models", Version 1, Chaouiya et al. 2013/2015): species, transitions with
// inputs/outputs and MathML function terms.

/** Three-gene repressilator-style ring LacI -| TetR -| CI -| LacI as SBML-qual, with a layout-free header. */
export const REPRESSOR_RING_SBML = `<?xml version="1.0" encoding="UTF-8"?>
<sbml xmlns="http://www.sbml.org/sbml/level3/version1/core" level="3" version="1"
      xmlns:qual="http://www.sbml.org/sbml/level3/version1/qual/version1" qual:required="true">
  <model id="repressor_ring" name="Repressor ring">
    <notes><body xmlns="http://www.w3.org/1999/xhtml"><p>Test fixture.</p></body></notes>
    <listOfCompartments>
      <compartment id="cell" constant="true"/>
    </listOfCompartments>
    <qual:listOfQualitativeSpecies>
      <qual:qualitativeSpecies qual:id="LacI" qual:compartment="cell" qual:constant="false" qual:maxLevel="1"/>
      <qual:qualitativeSpecies qual:id="TetR" qual:compartment="cell" qual:constant="false" qual:maxLevel="1"/>
      <qual:qualitativeSpecies qual:id="CI" qual:compartment="cell" qual:constant="false" qual:maxLevel="1"/>
    </qual:listOfQualitativeSpecies>
    <qual:listOfTransitions>
      <qual:transition qual:id="t_TetR">
        <qual:listOfInputs><qual:input qual:id="i1" qual:qualitativeSpecies="LacI" qual:transitionEffect="none" qual:sign="negative"/></qual:listOfInputs>
        <qual:listOfOutputs><qual:output qual:id="o1" qual:qualitativeSpecies="TetR" qual:transitionEffect="assignmentLevel"/></qual:listOfOutputs>
        <qual:listOfFunctionTerms>
          <qual:defaultTerm qual:resultLevel="0"/>
          <qual:functionTerm qual:resultLevel="1">
            <math xmlns="http://www.w3.org/1998/Math/MathML"><apply><eq/><ci>LacI</ci><cn type="integer">0</cn></apply></math>
          </qual:functionTerm>
        </qual:listOfFunctionTerms>
      </qual:transition>
      <qual:transition qual:id="t_CI">
        <qual:listOfInputs><qual:input qual:id="i2" qual:qualitativeSpecies="TetR" qual:transitionEffect="none" qual:sign="negative"/></qual:listOfInputs>
        <qual:listOfOutputs><qual:output qual:id="o2" qual:qualitativeSpecies="CI" qual:transitionEffect="assignmentLevel"/></qual:listOfOutputs>
        <qual:listOfFunctionTerms>
          <qual:defaultTerm qual:resultLevel="0"/>
          <qual:functionTerm qual:resultLevel="1">
            <math xmlns="http://www.w3.org/1998/Math/MathML"><apply><eq/><ci>TetR</ci><cn type="integer">0</cn></apply></math>
          </qual:functionTerm>
        </qual:listOfFunctionTerms>
      </qual:transition>
      <qual:transition qual:id="t_LacI">
        <qual:listOfInputs><qual:input qual:id="i3" qual:qualitativeSpecies="CI" qual:transitionEffect="none" qual:sign="negative"/></qual:listOfInputs>
        <qual:listOfOutputs><qual:output qual:id="o3" qual:qualitativeSpecies="LacI" qual:transitionEffect="assignmentLevel"/></qual:listOfOutputs>
        <qual:listOfFunctionTerms>
          <qual:defaultTerm qual:resultLevel="0"/>
          <qual:functionTerm qual:resultLevel="1">
            <math xmlns="http://www.w3.org/1998/Math/MathML"><apply><eq/><ci>CI</ci><cn type="integer">0</cn></apply></math>
          </qual:functionTerm>
        </qual:listOfFunctionTerms>
      </qual:transition>
    </qual:listOfTransitions>
  </model>
</sbml>
`;

/** The same file with one species made three-valued, which a Boolean reader must refuse by name. */
export const MULTIVALUED_SBML = REPRESSOR_RING_SBML.replace(
  'qual:id="CI" qual:compartment="cell" qual:constant="false" qual:maxLevel="1"',
  'qual:id="CI" qual:compartment="cell" qual:constant="false" qual:maxLevel="2"',
);
