/** Tests run the core as the front ends do: with mathjs installed as the expression simplifier of the fixes. */
import { simplify, parse } from 'mathjs';
import { setExpressionSimplifier } from '@kernwright/core';

setExpressionSimplifier((expression) => simplify(parse(expression)).toString({ parenthesis: 'auto', implicit: 'show' }));
